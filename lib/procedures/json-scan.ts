// JSON.parse keeps the last of two members with the same name and says nothing; a procedure file where
// a step has two "torqueNm" would import a value the author may not have meant. This scan (of text that
// JSON.parse has already accepted) reports every repeated member name with where it is.
export type JsonPath = (string | number)[];

type Frame = { kind: "object"; path: JsonPath; keys: Set<string>; expectingKey: boolean; key: string | null } | { kind: "array"; path: JsonPath; index: number };

export function duplicateMembers(text: string): { path: JsonPath; name: string }[] {
  const found: { path: JsonPath; name: string }[] = [];
  const stack: Frame[] = [];
  const childPath = (): JsonPath => {
    const top = stack[stack.length - 1];
    if (!top) return [];
    return top.kind === "object" ? [...top.path, top.key ?? ""] : [...top.path, top.index];
  };
  let i = 0;
  while (i < text.length) {
    const c = text[i]!;
    if (c === '"') {
      let j = i + 1;
      while (j < text.length && text[j] !== '"') j += text[j] === "\\" ? 2 : 1;
      const top = stack[stack.length - 1];
      if (top?.kind === "object" && top.expectingKey) {
        const name = JSON.parse(text.slice(i, j + 1)) as string;
        if (top.keys.has(name)) found.push({ path: [...top.path, name], name });
        top.keys.add(name);
        top.key = name;
        top.expectingKey = false;
      }
      i = j + 1;
      continue;
    }
    if (c === "{") stack.push({ kind: "object", path: childPath(), keys: new Set(), expectingKey: true, key: null });
    else if (c === "[") stack.push({ kind: "array", path: childPath(), index: 0 });
    else if (c === "}" || c === "]") stack.pop();
    else if (c === ",") {
      const top = stack[stack.length - 1];
      if (top?.kind === "object") top.expectingKey = true;
      else if (top?.kind === "array") top.index += 1;
    }
    i += 1;
  }
  return found;
}

// "content.sections[0].steps[2].kind"
export function formatPath(path: readonly PropertyKey[]): string {
  let out = "";
  for (const part of path) {
    if (typeof part === "number") out += `[${part}]`;
    else out += out ? `.${String(part)}` : String(part);
  }
  return out;
}
