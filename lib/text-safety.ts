// Control characters in text a person sends: PostgreSQL refuses NUL in text and jsonb outright, and the
// others are invisible on every screen and paper that would show them. Tab, line feed and carriage return
// stay allowed: notes and descriptions hold several lines.
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;

// "U+0000" for the first control character in the text, or null.
export function controlCharacterIn(text: string): string | null {
  const m = CONTROL.exec(text);
  return m ? `U+${m[0].charCodeAt(0).toString(16).toUpperCase().padStart(4, "0")}` : null;
}

export function controlCharacterMessage(code: string): string {
  return `Remove the invisible control character (${code}); it cannot be stored.`;
}

/**
 * Every string and member name in a parsed JSON value that holds a control character, with its path.
 * Iterative, so a deep value cannot exhaust the stack; stops after `limit` finds.
 */
export function controlCharacterPaths(value: unknown, limit = 20): { path: (string | number)[]; code: string }[] {
  const found: { path: (string | number)[]; code: string }[] = [];
  const stack: { v: unknown; path: (string | number)[] }[] = [{ v: value, path: [] }];
  while (stack.length && found.length < limit) {
    const { v, path } = stack.pop()!;
    if (typeof v === "string") {
      const code = controlCharacterIn(v);
      if (code) found.push({ path, code });
    } else if (Array.isArray(v)) {
      for (let i = v.length - 1; i >= 0; i--) stack.push({ v: v[i], path: [...path, i] });
    } else if (v && typeof v === "object") {
      const entries = Object.entries(v);
      for (let e = entries.length - 1; e >= 0; e--) {
        const [k, child] = entries[e]!;
        const code = controlCharacterIn(k);
        if (code) found.push({ path: [...path, k], code });
        stack.push({ v: child, path: [...path, k] });
      }
    }
  }
  return found;
}
