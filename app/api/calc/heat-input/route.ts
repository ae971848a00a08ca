import { heatInput } from "@/lib/welding";
import { heatInputRequestSchema } from "@/lib/welding/schema";
import { calcRoute } from "../_lib/calc-route";

export const dynamic = "force-dynamic";

// ASME IX QW-409.1(a) J/in and ISO/TR 17671-1 arc energy and heat input Q, kJ/mm.
export const POST = calcRoute(heatInputRequestSchema, (body) => heatInput(body));
