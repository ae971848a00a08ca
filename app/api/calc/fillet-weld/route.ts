import { filletWeld } from "@/lib/welding";
import { filletWeldRequestSchema } from "@/lib/welding/schema";
import { calcRoute } from "../_lib/calc-route";

export const dynamic = "force-dynamic";

// Fillet throat, AISC 360-16 J2.4 strength (LRFD or ASD), AWS D1.1 Table 7.7 minimum size, bracket check. SI.
export const POST = calcRoute(filletWeldRequestSchema, (body) => filletWeld(body));
