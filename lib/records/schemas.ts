import { z } from "zod";
import { normalisePaperSeal, PAPER_SEAL_MIN } from "./paper-seal";

const SEAL_MESSAGE = `The seal is the ${PAPER_SEAL_MIN} to 64 letters a–f and digits printed on the traveller (the QR carries them).`;

/** ?seal= of the verify API and page: optional; when given, the leading hex digits of the paper's seal. */
const paperSealField = z
  .string()
  .max(200, SEAL_MESSAGE)
  .transform((text, ctx) => {
    const seal = normalisePaperSeal(text);
    if (!seal) {
      ctx.addIssue({ code: "custom", message: SEAL_MESSAGE });
      return z.NEVER;
    }
    return seal;
  });

export const verifyQuerySchema = z.object({ seal: paperSealField.optional() });
