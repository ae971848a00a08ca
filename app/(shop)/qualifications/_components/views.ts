import type { QualificationRow } from "@/db/queries/qualifications";
import type { UnitSystem } from "@/lib/units";
import { measure } from "../../wps/_components/format";
import type { QualificationView } from "./qualifications-table";

export function thicknessText(r: Pick<QualificationRow, "thicknessMinMm" | "thicknessMaxMm">, system: UnitSystem) {
  return `${measure("length", r.thicknessMinMm, system)} to ${r.thicknessMaxMm === null ? "unlimited" : measure("length", r.thicknessMaxMm, system)}`;
}

export function diameterText(r: Pick<QualificationRow, "diameterMinMm" | "diameterMaxMm">, system: UnitSystem) {
  if (r.diameterMinMm === null && r.diameterMaxMm === null) return "plate or any pipe";
  if (r.diameterMaxMm === null) return `${measure("length", r.diameterMinMm, system)} and over`;
  if (r.diameterMinMm === null) return `up to ${measure("length", r.diameterMaxMm, system)}`;
  return `${measure("length", r.diameterMinMm, system)} to ${measure("length", r.diameterMaxMm, system)}`;
}

export function toView(r: QualificationRow, system: UnitSystem): QualificationView {
  return {
    id: r.id,
    welderName: r.welderName,
    process: r.process,
    positions: r.positions,
    thickness: thicknessText(r, system),
    diameter: diameterText(r, system),
    fillerFNumber: r.fillerFNumber,
    testDate: r.testDate,
    lastUsedOn: r.lastUsedOn,
    status: r.continuity.status,
    expiresOn: r.continuity.expiresOn,
    lastValidOn: r.continuity.lastValidOn,
    daysLeft: r.continuity.daysLeft,
    hasCertificate: r.certificate !== null,
  };
}
