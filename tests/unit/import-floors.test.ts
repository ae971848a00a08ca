// The lint rule that keeps imports flowing downward (eslint.config.mjs, docs/architecture.md): an upward
// import placed in a lower floor must be reported, so CI fails on it; the same import one floor up passes.
import path from "node:path";
import { ESLint } from "eslint";
import { beforeAll, describe, expect, it } from "vitest";

const root = path.resolve(import.meta.dirname, "../..");
let eslint: ESLint;

beforeAll(async () => {
  // The project's own config; the cycle check is left out because it reads each linted file from disk.
  eslint = new ESLint({ cwd: root, overrideConfig: { rules: { "import/no-cycle": "off" } } });
  // The first run loads every plugin and resolver; later runs are quick.
  await eslint.lintText("export {};\n", { filePath: path.join(root, "lib/floor-probe.ts") });
}, 60_000);

async function floorErrors(file: string, code: string) {
  const [result] = await eslint.lintText(code, { filePath: path.join(root, file) });
  return (result?.messages ?? []).filter((m) => m.ruleId === "import/no-restricted-paths");
}

// Real modules on each floor, so the resolver finds them as it would in a real file.
const ROUTE_MODULE = `import { POST } from "@/app/api/wps/route";\nexport const probe = POST;\n`;
const ROUTE_MODULE_RELATIVE = `import { POST } from "../../app/api/wps/route";\nexport const probe = POST;\n`;
const UI_MODULE = `import { SafetyNote } from "@/components/safety-note";\nexport const probe = SafetyNote;\n`;
const DOMAIN_MODULE = `import { SAFETY_NOTE } from "@/lib/safety";\nexport const probe = SAFETY_NOTE;\n`;

describe("import floors", () => {
  it("reports db/ importing from a route", async () => {
    const errors = await floorErrors("db/queries/floor-probe.ts", ROUTE_MODULE);
    expect(errors).toHaveLength(1);
    expect(errors[0]!.message).toContain("db/ and lib/ sit below the routes");
  });

  it("reports a relative upward import as well as an aliased one", async () => {
    const errors = await floorErrors("db/queries/floor-probe.ts", ROUTE_MODULE_RELATIVE);
    expect(errors).toHaveLength(1);
  });

  it("reports lib/ importing from a route or from components/", async () => {
    expect(await floorErrors("lib/jobs/floor-probe.ts", ROUTE_MODULE)).toHaveLength(1);
    const ui = await floorErrors("lib/pdf/floor-probe.tsx", UI_MODULE);
    expect(ui).toHaveLength(1);
    expect(ui[0]!.message).toContain("never import UI");
  });

  it("reports db/ importing from components/", async () => {
    expect(await floorErrors("db/schema/floor-probe.ts", UI_MODULE)).toHaveLength(1);
  });

  it("reports components/ importing from a route", async () => {
    const errors = await floorErrors("components/floor-probe.tsx", ROUTE_MODULE);
    expect(errors).toHaveLength(1);
    expect(errors[0]!.message).toContain("components/ never import from a route");
  });

  it("lets each floor import downward", async () => {
    expect(await floorErrors("app/api/floor-probe/route.ts", UI_MODULE)).toHaveLength(0);
    expect(await floorErrors("app/api/floor-probe/route.ts", ROUTE_MODULE)).toHaveLength(0);
    expect(await floorErrors("components/floor-probe.tsx", DOMAIN_MODULE)).toHaveLength(0);
    expect(await floorErrors("db/queries/floor-probe.ts", DOMAIN_MODULE)).toHaveLength(0);
  });
});
