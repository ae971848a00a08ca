import "server-only";
import { notFound } from "next/navigation";
import { z } from "zod";
import { getRevision } from "@/db/queries/wps";
import { AppError } from "@/lib/errors";

// For pages: a malformed id or number, or another shop's WPS, is the plain 404 page.
export async function loadRevision(shopId: string, id: string, n: string) {
  const number = z.coerce.number().int().min(1).max(100_000).safeParse(n);
  if (!z.string().uuid().safeParse(id).success || !number.success) notFound();
  try {
    return await getRevision(shopId, id, number.data);
  } catch (error) {
    if (error instanceof AppError && error.code === "not_found") notFound();
    throw error;
  }
}
