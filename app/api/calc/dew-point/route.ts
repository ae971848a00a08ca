import { checkDewPoint } from "@/lib/coating";
import { dewPointRequestSchema } from "@/lib/coating/schemas";
import { calcRoute } from "../_lib/calc-route";

export const dynamic = "force-dynamic";

// Magnus dew point (Alduchov & Eskridge 1996) and the surface-temperature margin gate before coating.
export const POST = calcRoute(dewPointRequestSchema, (body) => checkDewPoint(body));
