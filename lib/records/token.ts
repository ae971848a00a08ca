// What a person scans or types: the traveller's whole URL, a bare token, or a token with stray spaces.
export function tokenFromScan(text: string): string | null {
  const trimmed = text.trim();
  const fromUrl = /\/verify\/([A-Za-z0-9_-]{20,64})(?:[/?#]|$)/.exec(trimmed);
  if (fromUrl) return fromUrl[1]!;
  const bare = trimmed.replace(/\s+/g, "");
  return /^[A-Za-z0-9_-]{20,64}$/.test(bare) ? bare : null;
}
