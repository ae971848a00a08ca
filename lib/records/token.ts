// The traveller's verify token: 160 random bits in base64url (27 characters); a little slack either way.
const TOKEN_CHARS = "[A-Za-z0-9_-]{20,64}";
const TOKEN = new RegExp(`^${TOKEN_CHARS}$`);
const TOKEN_IN_URL = new RegExp(`/verify/(${TOKEN_CHARS})(?:[/?#]|$)`);

export function isVerifyToken(text: string): boolean {
  return TOKEN.test(text);
}

// What a person scans or types: the traveller's whole URL, a bare token, or a token with stray spaces.
export function tokenFromScan(text: string): string | null {
  const trimmed = text.trim();
  const fromUrl = TOKEN_IN_URL.exec(trimmed);
  if (fromUrl) return fromUrl[1]!;
  const bare = trimmed.replace(/\s+/g, "");
  return isVerifyToken(bare) ? bare : null;
}
