import "server-only";
import { and, eq } from "drizzle-orm";
import sharp from "sharp";
import { procedureVersion } from "@/db/schema";
import type { ShopContext } from "@/lib/auth/context";
import { db } from "@/lib/db";
import { publicBaseUrl } from "@/lib/net/shop-certificate";
import { mailHtml, sendMail } from "@/lib/mail";
import { renderTraveller } from "@/lib/pdf";
import { verifyUrlWithSeal } from "@/lib/records/paper-seal";
import { buildTravellerData } from "@/lib/traveller/build";
import { getJobRecord } from "./jobs-core";
import { archiveAddress } from "./shop-settings";
import { photoForServing } from "./jobs-photos";
import { procedureImageForServing } from "./procedure-images";
import { shownIntegrity, tokenForJob, verifyJobRecord } from "./records";

// The QR is scanned by other devices, so it carries the public address, never this computer's loopback one.
function verifyUrlFor(token: string) {
  return `${publicBaseUrl()}/verify/${token}`;
}

// The whole traveller of one job of the person's shop, as PDF bytes.
export async function travellerPdf(ctx: ShopContext, jobId: string, paper: "a4" | "letter") {
  const record = await getJobRecord(ctx, jobId);
  const [integrity, token, [version]] = await Promise.all([
    verifyJobRecord(jobId),
    tokenForJob(db(), { shopId: ctx.shopId, jobId }),
    db()
      .select({ contentHash: procedureVersion.contentHash })
      .from(procedureVersion)
      .where(and(eq(procedureVersion.id, record.job.procedureVersionId), eq(procedureVersion.shopId, ctx.shopId))),
  ]);
  const photos = [];
  for (const p of record.photos.filter((ph) => !ph.removed).slice(0, 60)) {
    const thumb = await photoForServing(ctx.shopId, p.id, "thumb").catch(() => null);
    if (!thumb) continue;
    const bytes = thumb.bytes;
    // The contact sheet takes JPEG; thumbnails are re-encoded whatever they were stored as.
    const step = record.steps.find((s) => s.id === p.stepId);
    photos.push({ image: await sharp(bytes).jpeg({ quality: 80 }).toBuffer(), caption: p.caption || step?.title || "", stepKey: step?.key, takenAt: p.uploadedAt, sha256: p.sha256 });
  }
  const weldMapImages = new Map<string, Buffer>();
  for (const img of record.weldMap?.images ?? []) {
    const found = img.photoId
      ? await photoForServing(ctx.shopId, img.photoId, "full").catch(() => null)
      : img.procedureImageId
        ? await procedureImageForServing(ctx.shopId, img.procedureImageId, "full").catch(() => null)
        : null;
    // Printed at a size that stays sharp on paper without making the PDF heavy.
    if (found) weldMapImages.set(img.id, await sharp(found.bytes).resize({ width: 1400, height: 1400, fit: "inside", withoutEnlargement: true }).jpeg({ quality: 82 }).toBuffer());
  }
  const seal = shownIntegrity(integrity).seal;
  const data = buildTravellerData(record, {
    weldMapImages,
    shopName: ctx.shop.name,
    versionHash: version?.contentHash ?? "0".repeat(64),
    seal: { sha256: seal ?? "0".repeat(64), entries: integrity.entries },
    // The QR carries the seal too, so a scan compares the paper with the database.
    verifyUrl: seal ? verifyUrlWithSeal(verifyUrlFor(token), seal) : verifyUrlFor(token),
    paper,
    unitSystem: ctx.unitSystem,
    photos,
  });
  const pdf = await renderTraveller(data);
  return { pdf, seal, entries: integrity.entries, verifyUrl: data.verifyUrl, jobNumber: record.job.number, released: record.job.status === "released", customerEmail: record.job.customerEmail, customerName: record.job.customerName };
}

// On release the customer gets the traveller, and the shop's archive address gets the seal: two copies of
// it outside the database, so a database rewritten later disagrees with them. A failure is logged and
// retried from the outbox; it never undoes or blocks the release.
export async function mailTravellerToCustomer(ctx: ShopContext, jobId: string): Promise<{ sent: boolean } | null> {
  try {
    const t = await travellerPdf(ctx, jobId, "a4");
    await mailSealToArchive(ctx, t).catch((error: unknown) => console.error(`[traveller] could not mail the seal of job ${jobId} to the archive:`, (error as Error).message));
    if (!t.customerEmail) return null;
    const lines = [
      `Job ${t.jobNumber} at ${ctx.shop.name} has been released. Its traveller is attached.`,
      "The QR code on it opens the record and checks that it has not been changed since it was signed.",
      ...sealLines(t),
      "The work supports, and never replaces, the vehicle maker's specifications, local codes and qualified or licensed practice.",
    ];
    const { sent } = await sendMail({
      shopId: ctx.shopId,
      to: t.customerEmail,
      subject: `Traveller for job ${t.jobNumber} from ${ctx.shop.name}`,
      text: `Hello ${t.customerName},\n\n${lines.join("\n\n")}\n`,
      html: mailHtml(`Job ${t.jobNumber} released`, [`Hello ${t.customerName},`, ...lines]),
      attachments: [{ filename: `${t.jobNumber}-traveller.pdf`, contentType: "application/pdf", content: t.pdf }],
    });
    return { sent };
  } catch (error) {
    console.error(`[traveller] could not mail the traveller of job ${jobId}:`, (error as Error).message);
    return null;
  }
}

type Released = { jobNumber: string; seal: string | null; entries: number; verifyUrl: string };

function sealLines(t: Released): string[] {
  if (!t.seal) return [];
  return [
    `Seal of the released record (SHA-256 over ${t.entries} signed entries): ${t.seal}`,
    `Keep this mail: anyone can check the record against this seal at ${t.verifyUrl}`,
  ];
}

async function mailSealToArchive(ctx: ShopContext, t: Released) {
  if (!t.seal) return;
  const { recipients } = await archiveAddress(ctx.shopId);
  const lines = [
    `Job ${t.jobNumber} at ${ctx.shop.name} was released.`,
    ...sealLines(t),
    "This copy lives outside the shop's database on purpose: if the record is ever rewritten, its seal will no longer match this one.",
  ];
  for (const to of recipients) {
    await sendMail({
      shopId: ctx.shopId,
      to,
      subject: `Seal of job ${t.jobNumber}: ${t.seal.slice(0, 16)}`,
      text: `${lines.join("\n\n")}\n`,
      html: mailHtml(`Seal of job ${t.jobNumber}`, lines),
    });
  }
}
