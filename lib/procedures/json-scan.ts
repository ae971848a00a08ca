// JSON.parse keeps the last of two members with the same name and says nothing; a procedure file where
// a step has two "torqueNm" would import a value the author may not have meant. This scan (of text that
// JSON.parse has already accepted) reports every repeated member name with where it is.
//
// Both scans here walk the text once with an explicit stack, so their cost is linear in the text whatever
// its nesting: a file of nothing but 100,000 "[" costs one pass, not one copy of the path per level.
export type JsonPath = (string | number)[];

// Deeper than any file or request Gusset writes; deep enough that honest data never meets it.
export const MAX_JSON_DEPTH = 64;

// Skips a string that starts at text[i] (a '"'); the index just past its closing quote (or the end).
function skipString(text: string, i: number): number {
  let j = i + 1;
  while (j < text.length) {
    const c = text.charCodeAt(j);
    if (c === 0x22) return j + 1;
    j += c === 0x5c ? 2 : 1;
  }
  return text.length;
}

// True when arrays and objects nest more than `max` levels anywhere in the text. Works on any text
// (valid JSON or not) and stops at the first level past the limit.
export function jsonDepthExceeds(text: string, max: number = MAX_JSON_DEPTH): boolean {
  let depth = 0;
  let i = 0;
  while (i < text.length) {
    const c = text.charCodeAt(i);
    if (c === 0x22) {
      i = skipString(text, i);
      continue;
    }
    if (c === 0x5b || c === 0x7b) {
      depth += 1;
      if (depth > max) return true;
    } else if (c === 0x5d || c === 0x7d) {
      if (depth > 0) depth -= 1;
    }
    i += 1;
  }
  return false;
}

type Frame = { kind: "object"; keys: Set<string>; expectingKey: boolean; key: string } | { kind: "array"; index: number };

// At most this many repeats are listed: enough to fix a file, and it bounds the work of building paths.
const MAX_REPORTED = 100;

export class JsonTooDeepError extends Error {
  constructor(public readonly max: number) {
    super(`The JSON is nested more than ${max} levels deep.`);
    this.name = "JsonTooDeepError";
  }
}

export function duplicateMembers(text: string, maxDepth: number = MAX_JSON_DEPTH): { path: JsonPath; name: string }[] {
  const found: { path: JsonPath; name: string }[] = [];
  const stack: Frame[] = [];
  // The path of the value the top frame is at, built only when a repeat is reported.
  const pathTo = (name: string): JsonPath => {
    const path: JsonPath = [];
    for (let d = 0; d < stack.length - 1; d++) {
      const f = stack[d]!;
      path.push(f.kind === "object" ? f.key : f.index);
    }
    path.push(name);
    return path;
  };
  let i = 0;
  while (i < text.length) {
    const c = text.charCodeAt(i);
    if (c === 0x22) {
      const end = skipString(text, i);
      const top = stack[stack.length - 1];
      if (top?.kind === "object" && top.expectingKey) {
        const raw = text.slice(i + 1, end - 1);
        const name = raw.includes("\\") ? (JSON.parse(text.slice(i, end)) as string) : raw;
        if (top.keys.has(name)) {
          if (found.length < MAX_REPORTED) found.push({ path: pathTo(name), name });
        } else top.keys.add(name);
        top.key = name;
        top.expectingKey = false;
      }
      i = end;
      continue;
    }
    if (c === 0x7b || c === 0x5b) {
      if (stack.length >= maxDepth) throw new JsonTooDeepError(maxDepth);
      stack.push(c === 0x7b ? { kind: "object", keys: new Set(), expectingKey: true, key: "" } : { kind: "array", index: 0 });
    } else if (c === 0x7d || c === 0x5d) stack.pop();
    else if (c === 0x2c) {
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
