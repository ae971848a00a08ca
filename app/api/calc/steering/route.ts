import { computeSteeringGeometry } from "@/lib/geometry";
import { calcRoute } from "../_lib/calc-route";
import { steeringRequestSchema } from "./schema";

export const dynamic = "force-dynamic";

// Front-view steering links at ride height: link angles, heave and roll sweeps, worst steer, hole ranking.
export const POST = calcRoute(steeringRequestSchema, (body) => computeSteeringGeometry(body));
