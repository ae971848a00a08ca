import "server-only";
import { createHash, randomBytes } from "node:crypto";
import { and, asc, count, desc, eq, ilike, inArray, isNotNull, isNull, or, sql } from "drizzle-orm";
import { invitation, membership, shop, shopActivity, user } from "@/db/schema";
import { account, session } from "@/db/schema/auth";
import type { Role } from "@/lib/authz";
import { hashPin, pinMatches, PIN_MAX_FAILURES } from "@/lib/auth/pin";
import { db } from "@/lib/db";
import { AppError } from "@/lib/errors";

const INVITATION_DAYS = 7;

type MemberRow = {
  membershipId: string;
  userId: string;
  name: string;
  /** printed on this person's sign-offs in this shop */
  legalName: string;
  email: string;
  roles: Role[];
  active: boolean;
  hasPin: boolean;
  pinLocked: boolean;
  joinedAt: Date;
};

// What a member row shows: never the PIN hash itself, only whether one is set or locked.
const memberColumns = {
  membershipId: membership.id,
  userId: user.id,
  name: user.name,
  legalName: membership.legalName,
  email: user.email,
  roles: membership.roles,
  active: membership.active,
  hasPin: sql<boolean>`${membership.pinHash} is not null`,
  pinLocked: sql<boolean>`${membership.pinLockedAt} is not null`,
  joinedAt: membership.createdAt,
};

export async function listMembers(shopId: string, opts: { q?: string; page: number; pageSize: number; includeInactive: boolean }) {
  const filters = [eq(membership.shopId, shopId)];
  if (!opts.includeInactive) filters.push(eq(membership.active, true));
  if (opts.q) {
    const like = `%${opts.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    filters.push(or(ilike(user.name, like), ilike(membership.legalName, like), ilike(user.email, like))!);
  }
  const where = and(...filters);
  const [rows, [total]] = await Promise.all([
    db()
      .select(memberColumns)
      .from(membership)
      .innerJoin(user, eq(user.id, membership.userId))
      .where(where)
      .orderBy(desc(membership.active), asc(user.name))
      .limit(opts.pageSize)
      .offset((opts.page - 1) * opts.pageSize),
    db().select({ n: count() }).from(membership).innerJoin(user, eq(user.id, membership.userId)).where(where),
  ]);
  return { rows: rows as MemberRow[], total: total?.n ?? 0 };
}

export async function listOpenInvitations(shopId: string) {
  return db()
    .select({ id: invitation.id, email: invitation.email, roles: invitation.roles, expiresAt: invitation.expiresAt, createdAt: invitation.createdAt })
    .from(invitation)
    .where(and(eq(invitation.shopId, shopId), isNull(invitation.acceptedAt), isNull(invitation.revokedAt), sql`${invitation.expiresAt} > now()`))
    .orderBy(desc(invitation.createdAt))
    .limit(50);
}

function tokenHash(token: string) {
  return createHash("sha256").update(token).digest("hex");
}

export async function createInvitation(args: { shopId: string; email: string; roles: Role[]; invitedBy: string }) {
  const email = args.email.trim().toLowerCase();
  const existing = await db()
    .select({ id: membership.id })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(and(eq(membership.shopId, args.shopId), eq(user.email, email)))
    .limit(1);
  if (existing.length) throw new AppError("conflict", `${email} is already a member of this shop.`, { email: ["Already a member."] });
  const token = randomBytes(24).toString("base64url");
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 86_400_000);
  await db().transaction(async (tx) => {
    await tx.insert(invitation).values({ shopId: args.shopId, email, roles: args.roles, tokenHash: tokenHash(token), invitedBy: args.invitedBy, expiresAt });
    await tx.insert(shopActivity).values({ shopId: args.shopId, actorId: args.invitedBy, action: "person.invited", detail: { email, roles: args.roles } });
  });
  return { token, email, expiresAt };
}

export async function findInvitation(token: string) {
  const [row] = await db()
    .select({
      id: invitation.id,
      shopId: invitation.shopId,
      shopName: shop.name,
      email: invitation.email,
      roles: invitation.roles,
      expiresAt: invitation.expiresAt,
      acceptedAt: invitation.acceptedAt,
      revokedAt: invitation.revokedAt,
    })
    .from(invitation)
    .innerJoin(shop, eq(shop.id, invitation.shopId))
    .where(eq(invitation.tokenHash, tokenHash(token)))
    .limit(1);
  if (!row) return null;
  const usable = !row.acceptedAt && !row.revokedAt && row.expiresAt.getTime() > Date.now();
  return { ...row, usable };
}

// Accepting creates the account when the address has none yet (password hashed by better-auth's own hasher).
export async function acceptInvitation(args: { token: string; name?: string; password?: string; signedInUserId?: string }) {
  const inv = await findInvitation(args.token);
  if (!inv || !inv.usable) throw new AppError("not_found", "This invitation is not valid any more. Ask your lead for a new one.");
  const { hashPassword } = await import("better-auth/crypto");
  return db().transaction(async (tx) => {
    let userId = args.signedInUserId ?? null;
    if (!userId) {
      const existing = await tx.select({ id: user.id }).from(user).where(eq(user.email, inv.email)).limit(1);
      if (existing.length) throw new AppError("conflict", `An account for ${inv.email} exists: sign in as that person to accept.`);
      if (!args.name || !args.password) throw new AppError("bad_request", "Name and password are needed.");
      userId = randomBytes(16).toString("hex");
      const now = new Date();
      await tx.insert(user).values({ id: userId, name: args.name, email: inv.email, emailVerified: true, createdAt: now, updatedAt: now });
      await tx.insert(account).values({
        id: randomBytes(16).toString("hex"),
        accountId: userId,
        providerId: "credential",
        userId,
        password: await hashPassword(args.password),
        createdAt: now,
        updatedAt: now,
      });
    }
    const updated = await tx
      .update(invitation)
      .set({ acceptedAt: new Date() })
      .where(and(eq(invitation.id, inv.id), isNull(invitation.acceptedAt)))
      .returning({ id: invitation.id });
    if (!updated.length) throw new AppError("conflict", "This invitation was used a moment ago.");
    // The printed name starts as the account's name; a lead corrects it on the People page.
    const [named] = await tx.select({ name: user.name }).from(user).where(eq(user.id, userId));
    await tx
      .insert(membership)
      .values({ shopId: inv.shopId, userId, roles: inv.roles, legalName: named?.name ?? args.name ?? inv.email })
      .onConflictDoUpdate({ target: [membership.shopId, membership.userId], set: { roles: inv.roles, active: true, deactivatedAt: null } });
    await tx.insert(shopActivity).values({ shopId: inv.shopId, actorId: userId, action: "person.joined", detail: { email: inv.email, roles: inv.roles } });
    return { shopId: inv.shopId, userId };
  });
}

/** Roles of the given memberships of this shop (others are left out). */
export async function membersRoles(shopId: string, membershipIds: string[]) {
  if (membershipIds.length === 0) return [];
  return db()
    .select({ id: membership.id, roles: membership.roles })
    .from(membership)
    .where(and(eq(membership.shopId, shopId), inArray(membership.id, membershipIds)));
}

async function memberOf(shopId: string, membershipId: string) {
  const [row] = await db()
    .select({ id: membership.id, userId: membership.userId, roles: membership.roles, active: membership.active })
    .from(membership)
    .where(and(eq(membership.id, membershipId), eq(membership.shopId, shopId)))
    .limit(1);
  if (!row) throw new AppError("not_found", "Person not found in this shop.");
  return row;
}

async function activeLeadCount(shopId: string) {
  const [row] = await db()
    .select({ n: count() })
    .from(membership)
    .where(and(eq(membership.shopId, shopId), eq(membership.active, true), sql`'lead' = any(${membership.roles})`));
  return row?.n ?? 0;
}

export async function setRoles(args: { shopId: string; membershipId: string; roles: Role[]; actorId: string }) {
  const target = await memberOf(args.shopId, args.membershipId);
  if (target.roles.includes("lead") && !args.roles.includes("lead") && target.active && (await activeLeadCount(args.shopId)) <= 1) {
    throw new AppError("conflict", "A shop needs at least one active lead; give the lead role to someone else first.", { roles: ["Keep the lead role."] });
  }
  await db().transaction(async (tx) => {
    await tx.update(membership).set({ roles: args.roles }).where(and(eq(membership.id, target.id), eq(membership.shopId, args.shopId)));
    await tx.insert(shopActivity).values({ shopId: args.shopId, actorId: args.actorId, action: "person.roles_set", detail: { userId: target.userId, from: target.roles, to: args.roles } });
  });
}

export async function setActive(args: { shopId: string; membershipId: string; active: boolean; actorId: string }) {
  const target = await memberOf(args.shopId, args.membershipId);
  if (!args.active) {
    if (target.userId === args.actorId) throw new AppError("conflict", "You cannot deactivate yourself.");
    if (target.roles.includes("lead") && target.active && (await activeLeadCount(args.shopId)) <= 1) {
      throw new AppError("conflict", "A shop needs at least one active lead.");
    }
  }
  await db().transaction(async (tx) => {
    await tx
      .update(membership)
      .set({ active: args.active, deactivatedAt: args.active ? null : new Date() })
      .where(and(eq(membership.id, target.id), eq(membership.shopId, args.shopId)));
    await tx.insert(shopActivity).values({ shopId: args.shopId, actorId: args.actorId, action: args.active ? "person.reactivated" : "person.deactivated", detail: { userId: target.userId } });
    // A deactivated person is signed out everywhere at once, not when their sessions run out; they can sign
    // in again for any other shop they still belong to.
    if (!args.active) await tx.delete(session).where(eq(session.userId, target.userId));
  });
}

// A lead sets the name printed on a member's sign-offs from now on; sign-offs already made keep theirs.
export async function setLegalName(args: { shopId: string; membershipId: string; legalName: string; actorId: string }) {
  await db().transaction(async (tx) => {
    const [target] = await tx
      .select({ id: membership.id, userId: membership.userId, legalName: membership.legalName })
      .from(membership)
      .where(and(eq(membership.id, args.membershipId), eq(membership.shopId, args.shopId)))
      .for("update");
    if (!target) throw new AppError("not_found", "Person not found in this shop.");
    if (target.legalName === args.legalName) return;
    await tx.update(membership).set({ legalName: args.legalName }).where(and(eq(membership.id, target.id), eq(membership.shopId, args.shopId)));
    await tx.insert(shopActivity).values({
      shopId: args.shopId,
      actorId: args.actorId,
      action: "person.legal_name_set",
      detail: { userId: target.userId, from: target.legalName, to: args.legalName },
    });
  });
}

export async function setOwnPin(args: { shopId: string; userId: string; pin: string }) {
  const pinHash = await hashPin(args.pin);
  await db().transaction(async (tx) => {
    await tx
      .update(membership)
      .set({ pinHash, pinSetAt: new Date(), pinFailures: 0, pinLockedAt: null })
      .where(and(eq(membership.shopId, args.shopId), eq(membership.userId, args.userId)));
    await tx.insert(shopActivity).values({ shopId: args.shopId, actorId: args.userId, action: "pin.set", detail: {} });
  });
}

// A lead's reset clears the PIN and the lock; the person sets a new one before signing again.
export async function resetPin(args: { shopId: string; membershipId: string; actorId: string }) {
  const target = await memberOf(args.shopId, args.membershipId);
  await db().transaction(async (tx) => {
    await tx
      .update(membership)
      .set({ pinHash: null, pinSetAt: null, pinFailures: 0, pinLockedAt: null })
      .where(and(eq(membership.id, target.id), eq(membership.shopId, args.shopId)));
    await tx.insert(shopActivity).values({ shopId: args.shopId, actorId: args.actorId, action: "pin.reset", detail: { userId: target.userId } });
  });
}

// Checks a signing PIN; the fifth wrong try locks signing until a lead resets it. Each attempt first takes
// one of the tries left in a single UPDATE ... RETURNING (counted as a failure until the PIN is found
// right), so parallel attempts queue on the row and no more PINs are ever compared than the lock allows.
export async function verifySigningPin(args: { shopId: string; userId: string; pin: string }) {
  const [claimed] = await db()
    .update(membership)
    .set({
      pinFailures: sql`${membership.pinFailures} + 1`,
      pinLockedAt: sql`case when ${membership.pinFailures} + 1 >= ${PIN_MAX_FAILURES} then now() else null end`,
    })
    .where(
      and(
        eq(membership.shopId, args.shopId),
        eq(membership.userId, args.userId),
        eq(membership.active, true),
        isNotNull(membership.pinHash),
        isNull(membership.pinLockedAt),
      ),
    )
    .returning({ id: membership.id, pinHash: membership.pinHash, failures: membership.pinFailures });
  if (!claimed?.pinHash) {
    const [row] = await db()
      .select({ pinHash: membership.pinHash, pinLockedAt: membership.pinLockedAt })
      .from(membership)
      .where(and(eq(membership.shopId, args.shopId), eq(membership.userId, args.userId), eq(membership.active, true)))
      .limit(1);
    if (!row) throw new AppError("forbidden", "You are not an active member of this shop.");
    if (!row.pinHash) throw new AppError("forbidden", "Set your signing PIN on the Account page first.");
    throw new AppError("locked", `Signing is locked after ${PIN_MAX_FAILURES} wrong PINs. Ask a lead to reset your PIN.`);
  }
  if (await pinMatches(args.pin, claimed.pinHash)) {
    // The right PIN gives every try back (and lifts a lock its own claim set), unless other attempts have
    // claimed tries since: those are still being counted.
    await db()
      .update(membership)
      .set({ pinFailures: 0, pinLockedAt: null })
      .where(and(eq(membership.id, claimed.id), eq(membership.pinFailures, claimed.failures)));
    return true;
  }
  const left = PIN_MAX_FAILURES - claimed.failures;
  if (left <= 0) throw new AppError("locked", "Wrong PIN. Signing is now locked; ask a lead to reset your PIN.");
  throw new AppError("forbidden", `Wrong PIN. ${left} ${left === 1 ? "try" : "tries"} left before signing locks.`, { pin: ["Wrong PIN."] });
}

export async function setUnitSystem(args: { shopId: string; userId: string; unitSystem: "metric" | "imperial" }) {
  await db().update(membership).set({ unitSystem: args.unitSystem }).where(and(eq(membership.shopId, args.shopId), eq(membership.userId, args.userId)));
}

export async function shopActivityPage(shopId: string, limit = 30) {
  return db()
    .select({ id: shopActivity.id, action: shopActivity.action, detail: shopActivity.detail, at: shopActivity.at, actorName: user.name })
    .from(shopActivity)
    .leftJoin(user, eq(user.id, shopActivity.actorId))
    .where(eq(shopActivity.shopId, shopId))
    .orderBy(desc(shopActivity.at))
    .limit(limit);
}

export async function getMember(shopId: string, membershipId: string): Promise<MemberRow> {
  const [row] = await db()
    .select(memberColumns)
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(and(eq(membership.id, membershipId), eq(membership.shopId, shopId)));
  if (!row) throw new AppError("not_found", "Person not found in this shop.");
  return row as MemberRow;
}

// The account password, asked again before a signing PIN changes.
export async function assertAccountPassword(userId: string, password: string) {
  const { verifyPassword } = await import("better-auth/crypto");
  const [row] = await db()
    .select({ hash: account.password })
    .from(account)
    .where(and(eq(account.userId, userId), eq(account.providerId, "credential")));
  if (!row?.hash || !(await verifyPassword({ hash: row.hash, password }))) {
    throw new AppError("forbidden", "That password is not right.", { password: ["Wrong password."] });
  }
}
