// The job form's VIN rule: checked per 49 CFR 565.15, a problem is a warning on the job, never a refusal.
import { checkVin, normalizeVin } from "@/lib/vin";

export function vinForJob(raw: string): { vin: string; warning: string | null; checkDigitOk: boolean | null } {
  const vin = normalizeVin(raw ?? "");
  if (vin === "") return { vin, warning: null, checkDigitOk: null };
  const result = checkVin(vin);
  return { vin, warning: result.warnings.length ? result.warnings.join(" ") : null, checkDigitOk: result.checkDigitOk ?? null };
}
