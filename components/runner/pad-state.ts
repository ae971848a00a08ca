"use client";
// Typed text per pad field, kept apart from the stored SI value so "12." or "-" can be on screen while the
// value stays what it last was. A field reports a value only when its text reads as a number.
import { useState } from "react";
import { padText, readPadNumber, toStored, type PadQuantity } from "@/lib/jobs/units";

export type PadSpec = { quantity: PadQuantity | null; unit: string };

export function initialText(stored: number | undefined | null, spec: PadSpec): string {
  if (typeof stored !== "number") return "";
  return spec.quantity ? padText(spec.quantity, stored, spec.unit) : String(Number(stored.toFixed(4)));
}

export function storedFrom(text: string, spec: PadSpec): number | undefined {
  const n = readPadNumber(text);
  if (n === null) return undefined;
  return spec.quantity ? toStored(spec.quantity, n, spec.unit) : n;
}

/** Several pad fields with one active at a time. */
export function usePadFields<K extends string>(initial: Record<K, string>, first: K) {
  const [texts, setTexts] = useState<Record<K, string>>(initial);
  const [active, setActive] = useState<K>(first);
  return { texts, setTexts, active, setActive, setText: (k: K, t: string) => setTexts((all) => ({ ...all, [k]: t })) };
}
