// Bounded waits for stopping things: a part that hangs must never keep the rest running.
import type { ChildProcess } from "node:child_process";
import { log } from "./log";

export function withTimeout<T>(promise: Promise<T>, ms: number): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const late = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`gave up after ${ms / 1000} s`)), ms);
  });
  return Promise.race([promise, late]).finally(() => clearTimeout(timer));
}

// SIGTERM, then SIGKILL if the process is still there after `ms`.
export async function stopChild(child: ChildProcess | undefined, ms = 8_000) {
  if (!child || child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise((r) => child.once("exit", r));
  child.kill("SIGTERM");
  try {
    await withTimeout(exited, ms);
  } catch {
    log("app", `the app did not stop within ${ms / 1000} s; killing it`);
    child.kill("SIGKILL");
    await withTimeout(exited, 2_000).catch(() => {});
  }
}
