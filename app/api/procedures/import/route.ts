import { NextResponse } from "next/server";
import { createProcedure } from "@/db/queries/procedures";
import { shopRoute } from "@/lib/api/route";
import { AppError } from "@/lib/errors";
import { parseProcedureFile, problemFields, PROCEDURE_FILE_MAX_BYTES } from "@/lib/procedures/file";
import { versionHash } from "@/lib/procedures/hash";
import { readBodyText } from "../_lib/params";

export const dynamic = "force-dynamic";

const CODES = { 400: "bad_request", 413: "payload_too_large", 422: "unprocessable" } as const;

// The body is the procedure file itself. It becomes a new procedure with one draft; nothing is saved when
// anything in it is wrong, and every problem is listed with where it is.
export const POST = shopRoute({ action: "procedure:write" }, async ({ ctx, req }) => {
  const parsed = parseProcedureFile(await readBodyText(req, PROCEDURE_FILE_MAX_BYTES));
  if (!parsed.ok) throw new AppError(CODES[parsed.status], parsed.message, problemFields(parsed.problems), { problems: parsed.problems });
  const { file } = parsed;
  const body = { title: file.procedure.title, scope: file.procedure.scope, code: file.procedure.code, content: file.content };
  const created = await createProcedure({ shopId: ctx.shopId, actorId: ctx.userId, ...body, via: "import" });
  const sourceHashMatches = file.source?.contentHash ? file.source.contentHash === versionHash(body) : null;
  return NextResponse.json(
    { procedure: { id: created.id, title: body.title }, version: { number: created.number, status: "draft" }, sourceHashMatches },
    { status: 201 },
  );
});
