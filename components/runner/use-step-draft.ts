"use client";
// The working value of one step on this tablet. Every change is kept in localStorage at once and sent to
// the server after a short pause, naming the version it was based on. A write based on an old version is
// refused by the server; the welder then sees the other value and chooses, so nothing is overwritten silently.
import { useCallback, useEffect, useRef, useState } from "react";
import type { JobRecord, StepView } from "@/lib/jobs/record";
import { apiJson, ApiError } from "./api";
import { useSetRecord } from "./use-job";

type Value = Record<string, unknown>;
export type SaveState = "saved" | "pending" | "saving" | "offline" | "conflict" | "refused";
export type Conflict = { theirs: Value | null; version: number; by: string; at: string | null; message: string };

type Local = { value: Value; baseVersion: number; at: number };

const AUTOSAVE_MS = 1200;

function readLocal(key: string): Local | null {
  try {
    const raw = localStorage.getItem(key);
    return raw ? (JSON.parse(raw) as Local) : null;
  } catch {
    return null;
  }
}

export function useStepDraft(jobId: string, step: StepView, enabled: boolean) {
  const setRecord = useSetRecord(jobId);
  const key = `gusset:draft:${jobId}:${step.id}`;
  const [draft, setDraftState] = useState<Value>(step.value ?? {});
  const [state, setState] = useState<SaveState>("saved");
  const [conflict, setConflict] = useState<Conflict | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [resetToken, setResetToken] = useState(0);
  const base = useRef(step.version);
  const dirty = useRef(false);
  const saving = useRef<Promise<boolean> | null>(null);
  const changeCount = useRef(0);
  const latest = useRef<Value>(step.value ?? {});

  // A value typed here but not yet sent (a reload, a lost connection) comes back from this tablet's storage.
  useEffect(() => {
    if (!enabled) return;
    const local = readLocal(key);
    if (!local) return;
    latest.current = local.value;
    dirty.current = true;
    /* eslint-disable react-hooks/set-state-in-effect -- restoring this tablet's unsent value once, after mount */
    setDraftState(local.value);
    setResetToken((t) => t + 1);
    if (local.baseVersion === step.version) setState("pending");
    else {
      setState("conflict");
      setConflict({
        theirs: step.value,
        version: step.version,
        by: step.updatedBy?.name ?? "Someone",
        at: step.updatedAt,
        message: `${step.updatedBy?.name ?? "Someone"} changed this step after your last unsent entry on this tablet. Both are shown; choose which to keep.`,
      });
      base.current = local.baseVersion;
    }
    /* eslint-enable react-hooks/set-state-in-effect */
    // Only on first mount for this step.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key, enabled]);

  // Another tablet's saved value shows here when nothing is being typed on this one.
  useEffect(() => {
    if (step.version === base.current || dirty.current || saving.current) return;
    base.current = step.version;
    latest.current = step.value ?? {};
    setDraftState(step.value ?? {});
    setResetToken((t) => t + 1);
  }, [step.version, step.value]);

  const save = useCallback(async (): Promise<boolean> => {
    if (saving.current) {
      await saving.current;
      if (!dirty.current) return true;
    }
    if (!dirty.current) return true;
    const run = (async () => {
      const sentCount = changeCount.current;
      const value = latest.current;
      setState("saving");
      try {
        const record = await apiJson<JobRecord>(`/api/jobs/${jobId}/steps/${step.id}/value`, { method: "PUT", body: { baseVersion: base.current, value } });
        const mine = record.steps.find((s) => s.id === step.id);
        if (mine) base.current = mine.version;
        if (changeCount.current === sentCount) {
          dirty.current = false;
          try {
            localStorage.removeItem(key);
          } catch {
            /* nothing stored */
          }
          setState("saved");
        } else setState("pending");
        setProblem(null);
        setRecord(record);
        return true;
      } catch (e) {
        if (e instanceof ApiError && e.status === 409 && e.extra.current) {
          const c = e.extra.current as { value: Value | null; version: number; updatedBy: { name: string } | null; updatedAt: string | null };
          setConflict({ theirs: c.value, version: c.version, by: c.updatedBy?.name ?? "Someone", at: c.updatedAt, message: e.message });
          setState("conflict");
        } else if (e instanceof ApiError && (e.status === 0 || e.status >= 500 || e.status === 401)) {
          setProblem(e.message);
          setState("offline");
        } else {
          setProblem(e instanceof ApiError ? e.message : "Not saved.");
          setState("refused");
        }
        return false;
      } finally {
        saving.current = null;
      }
    })();
    saving.current = run;
    return run;
  }, [jobId, key, setRecord, step.id]);

  const setDraft = useCallback(
    (value: Value) => {
      latest.current = value;
      dirty.current = true;
      changeCount.current += 1;
      setDraftState(value);
      try {
        localStorage.setItem(key, JSON.stringify({ value, baseVersion: base.current, at: Date.now() } satisfies Local));
      } catch {
        /* storage off: the server save still runs */
      }
      setState((s) => (s === "conflict" ? s : "pending"));
    },
    [key],
  );

  // Save after a pause in typing; retry every few seconds while the connection is down.
  useEffect(() => {
    if (state !== "pending" && state !== "offline") return;
    const t = setTimeout(() => void save(), state === "offline" ? 5000 : AUTOSAVE_MS);
    return () => clearTimeout(t);
  }, [state, draft, save]);

  // Leaving the step (the section map, Next) sends what is typed; it is in local storage meanwhile anyway.
  const conflictRef = useRef(false);
  useEffect(() => {
    conflictRef.current = conflict !== null;
  }, [conflict]);
  const saveRef = useRef(save);
  useEffect(() => {
    saveRef.current = save;
  }, [save]);
  useEffect(
    () => () => {
      if (dirty.current && !conflictRef.current) void saveRef.current();
    },
    [],
  );

  const useTheirs = useCallback(() => {
    if (!conflict) return;
    base.current = conflict.version;
    latest.current = conflict.theirs ?? {};
    dirty.current = false;
    try {
      localStorage.removeItem(key);
    } catch {
      /* nothing stored */
    }
    setDraftState(conflict.theirs ?? {});
    setConflict(null);
    setState("saved");
    setResetToken((t) => t + 1);
  }, [conflict, key]);

  const keepMine = useCallback(() => {
    if (!conflict) return;
    base.current = conflict.version;
    setConflict(null);
    dirty.current = true;
    setState("pending");
    void save();
  }, [conflict, save]);

  return { draft, setDraft, save, state, conflict, problem, resetToken, useTheirs, keepMine, baseVersion: () => base.current, isDirty: () => dirty.current };
}
