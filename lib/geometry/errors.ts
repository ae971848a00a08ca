/** Why a geometry cannot be computed; the API maps every one of these to HTTP 422. */
export type GeometryErrorReason =
  | "non_finite_input"
  | "zero_length_link"
  | "vertical_link"
  | "unreachable"
  | "steer_out_of_range"
  | "bad_steering_arm"
  | "bad_step"
  | "bad_range"
  | "too_many_points";

/**
 * Thrown for input that is well-formed but physically impossible (or, for direct callers that skipped
 * the zod schema, out of bounds). `code` is constant so a route can map it without importing the class.
 */
export class GeometryError extends Error {
  readonly code = "impossible_geometry" as const;
  readonly reason: GeometryErrorReason;

  constructor(reason: GeometryErrorReason, message: string) {
    super(message);
    this.name = "GeometryError";
    this.reason = reason;
  }
}

/** instanceof fails across duplicated bundles; the code field does not. */
export function isGeometryError(e: unknown): e is GeometryError {
  return (
    e instanceof GeometryError ||
    (typeof e === "object" && e !== null && (e as { code?: unknown }).code === "impossible_geometry")
  );
}
