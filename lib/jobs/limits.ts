// Limits the runner checks in the browser before sending. Kept apart from ./schemas so the runner's first
// load carries no zod; the server checks the same figures again.
export const PHOTO_MAX_BYTES = 20 * 1024 * 1024;
