/** SHA-256 for the server. Kept apart from the pure pieces so only this file needs Node. */
import { createHash } from "node:crypto";

/** Lower-case hex SHA-256 of the UTF-8 bytes of `text`. */
export function sha256Hex(text: string): string {
  return createHash("sha256").update(text, "utf8").digest("hex");
}
