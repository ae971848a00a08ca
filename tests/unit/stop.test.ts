import { spawn } from "node:child_process";
import { describe, expect, it } from "vitest";
import { stopChild, withTimeout } from "../../scripts/lib/processes";

describe("stopping what npm start started", () => {
  it("kills a process that ignores SIGTERM once the bound has passed", async () => {
    const child = spawn(process.execPath, ["-e", "process.on('SIGTERM', () => {}); console.log('up'); setInterval(() => {}, 1000);"], { stdio: ["ignore", "pipe", "ignore"] });
    await new Promise((r) => child.stdout!.once("data", r));
    const started = Date.now();
    await stopChild(child, 500);
    expect(child.signalCode).toBe("SIGKILL");
    // Without the bound this would wait forever; the margin is for a busy machine.
    expect(Date.now() - started).toBeLessThan(6_000);
  });

  it("lets a process that stops on SIGTERM stop by itself", async () => {
    const child = spawn(process.execPath, ["-e", "console.log('up'); setInterval(() => {}, 1000);"], { stdio: ["ignore", "pipe", "ignore"] });
    await new Promise((r) => child.stdout!.once("data", r));
    await stopChild(child, 5_000);
    expect(child.signalCode).toBe("SIGTERM");
  });

  it("gives up on a stop that never finishes", async () => {
    await expect(withTimeout(new Promise(() => {}), 100)).rejects.toThrow(/gave up after 0.1 s/);
    await expect(withTimeout(Promise.resolve(7), 100)).resolves.toBe(7);
  });
});
