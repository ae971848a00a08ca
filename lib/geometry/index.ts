/**
 * Steering-link geometry of a solid front axle, front view. Pure: no DOM, no Node APIs.
 *
 * Conventions (all lengths mm, angles degrees, frame-fixed axes at ride height):
 * - y lateral, z up. Heave travel h > 0 is bump (axle toward the frame); the axle moves rigidly by (s, h).
 * - Roll φ > 0 is counter-clockwise in the y-z plane seen from the front: a point on the +y side rises.
 *   The axle turns about axleCenter, then shifts laterally by s; there is no heave during the roll sweep.
 * - axleShift s: lateral axle move that keeps the lateral link's length, on the ride-height side of its
 *   frame end (the root continuous with s = 0 at ride height). + = toward +y.
 * - dragLinkError d: y the drag link forces the arm end to (keeping |K − P|) minus where the rigidly moved
 *   axle put it. + = the drag link pushes the arm end toward +y. Measured along frame y in roll too (the
 *   cos φ difference to the axle's own lateral axis is ignored).
 * - wheelSteerDeg = asin(d / r), same sign as d; whether that is toe-in or toe-out on a given side depends
 *   on the arm pointing ahead of or behind the kingpin, which this front view does not know.
 *   steeringWheelDeg = wheelSteerDeg × steeringRatio.
 * - Link angles: atan2(dz, dy) of the link, folded to (−90, 90], so either end may be taken first;
 *   + = the link rises toward +y. angleDifferenceDeg = drag − lateral link, folded the same way.
 * - First order: d ≈ h·(tan θ_link − tan θ_drag) with the tangents being these dz/dy slopes (DESIGN.md's
 *   sign). REFERENCES.md writes Δz·(tan θ_drag − tan θ_link): same magnitude, d taken the other way
 *   (the axle's move relative to the drag link's arc). Parallel links: no first-order steer; parallel
 *   and equal (a parallelogram): none at all.
 * - Candidate holes are positions of the lateral link's AXLE end (the new bracket goes on the housing),
 *   each with its own bar length |hole − F|. candidateEnd: "frame" moves the frame end instead.
 *   Holes are ranked by worst |wheel steer| over the heave sweep only.
 */
export { computeSteeringGeometry, linkAngleDeg, candidateList, toeAtRim, COMBINED_MAX_EVALUATIONS } from "./steering";
export { GeometryError, isGeometryError, type GeometryErrorReason } from "./errors";
export { LIMITS, holeRangeCount, sweepCount, sweepValues } from "./limits";
export { steeringInputSchema, type SteeringInputParsed } from "./schema";
export type * from "./types";
