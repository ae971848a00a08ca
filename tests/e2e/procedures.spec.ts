import { expect, signedInAs, test } from "./support";

test("a lead writes a procedure from a starter, publishes it, edits version 2, publishes it with a note and sees the diff", async ({ page }) => {
  const title = `Coating, e2e ${Date.now()}`;
  await signedInAs(page, "lead@irongully.example");
  await page.goto("/procedures");
  await page.getByRole("link", { name: "New procedure" }).click();
  await page.getByLabel("Start from").selectOption("coat-repaired-area");
  // Choosing a starter fills in what it says about itself.
  await expect(page.getByLabel("Code or standard it follows")).toHaveValue(/SSPC-PA 2/);
  await page.getByLabel("Title").fill(title);
  await page.getByRole("button", { name: "Create draft" }).click();
  await expect(page.getByRole("heading", { level: 1, name: `Draft v1: ${title}` })).toBeVisible();

  // Version 1: publishing asks for a change note first.
  await page.getByTestId("go-publish").click();
  await page.getByRole("button", { name: "Publish version 1" }).click();
  await expect(page.getByTestId("error-changeNote")).toContainText("Write a change note");
  await page.getByLabel(/Change note/).fill("First issue for the shop.");
  await page.getByRole("button", { name: "Publish version 1" }).click();
  await expect(page.getByTestId("published-banner")).toContainText("Version 1 published");
  await expect(page.getByTestId("version-status")).toContainText("Published");
  await expect(page.getByTestId("content-hash")).toHaveText(/^[0-9a-f]{64}$/);

  // Version 2 starts as a copy of version 1.
  await page.getByRole("button", { name: "Start version 2" }).click();
  await expect(page.getByRole("heading", { level: 1, name: `Draft v2: ${title}` })).toBeVisible();

  // Change a kind-specific field of one step.
  await page.getByTestId("outline-step-coat-topcoat").getByRole("link").click();
  const form = page.getByTestId("step-form");
  await expect(form.getByLabel("Title")).toHaveValue("Topcoat");
  await form.getByLabel("DFT max").fill("90");
  await form.getByRole("button", { name: "Save step" }).click();
  await expect(page.getByTestId("step-form").getByLabel("DFT max")).toHaveValue("90");

  // Add a step; an empty title is named inline before anything is saved.
  await page.getByTestId("add-step-coat-apply").click();
  const added = page.getByTestId("step-form");
  await added.getByLabel("Kind").selectOption("check");
  await added.getByRole("button", { name: "Add step" }).click();
  await expect(page.getByTestId("error-step.title")).toHaveText("A title is required.");
  await added.getByLabel("Title").fill("Record the coating batch numbers");
  // Nobody types a key: the editor makes one from the title and keeps it when the title changes later.
  await expect(added.getByLabel("Key")).toHaveCount(0);
  await added.getByRole("button", { name: "Add step" }).click();
  await expect(page.getByTestId("outline-step-record-the-coating-batch-numbers")).toContainText("▸ editing");
  const saved = page.getByTestId("step-form");
  await expect(saved.getByTestId("step-key")).toContainText("record-the-coating-batch-numbers");
  await saved.getByLabel("Title").fill("Record coating batch and lot numbers");
  await saved.getByRole("button", { name: "Save step" }).click();
  await expect(page.getByTestId("outline-step-record-the-coating-batch-numbers")).toContainText("Record coating batch and lot numbers");

  // Reorder: move the new step up one place.
  await page.getByRole("button", { name: "Move “Record coating batch and lot numbers” up" }).click();
  await expect(page.getByTestId("outline-section-coat-apply").locator("li").nth(4)).toContainText("Record coating batch and lot numbers");

  // Publish version 2 with a note and land on the diff against version 1.
  await page.getByTestId("go-publish").click();
  await expect(page.getByTestId("diff-summary")).toContainText("1 added");
  await page.getByLabel(/Change note/).fill("Thicker topcoat allowed; coating batch numbers recorded.");
  await page.getByRole("button", { name: "Publish version 2" }).click();

  await expect(page).toHaveURL(/\/diff\?from=1&to=2/);
  await expect(page.getByTestId("published-banner")).toContainText("Version 2 published");
  await expect(page.getByTestId("diff-change-note")).toContainText("Thicker topcoat allowed");
  const summary = page.getByTestId("diff-summary");
  await expect(summary).toContainText("1 added");
  await expect(summary).toContainText("1 changed");
  const topcoat = page.getByTestId("diff-row-coat-topcoat");
  await expect(topcoat).toHaveAttribute("data-change", "changed");
  await expect(topcoat.getByTestId("change-dftMaxUm").first()).toContainText("80");
  await expect(topcoat.getByTestId("change-dftMaxUm").last()).toContainText("90");
  await expect(page.getByTestId("diff-row-record-the-coating-batch-numbers")).toHaveAttribute("data-change", "added");
  await expect(page.getByRole("columnheader", { name: "v1 · Retired" }).first()).toBeVisible();
  await expect(page.getByRole("columnheader", { name: "v2 · Published" }).first()).toBeVisible();

  // The list shows the new history by word and shape.
  await page.goto(`/procedures?q=${encodeURIComponent(title)}`);
  const versions = page.getByRole("list", { name: `Versions of ${title}` });
  await expect(versions).toContainText("v1Retired");
  await expect(versions).toContainText("v2Published");
});

test("a welder reads procedures but has no way to change them", async ({ page }) => {
  await signedInAs(page, "welder@irongully.example");
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Procedures" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Procedures" })).toBeVisible();
  await expect(page.getByRole("link", { name: "New procedure" })).toHaveCount(0);
  await page.getByLabel("Search title, scope or code").fill("Visual inspection of bracket welds");
  await page.getByRole("button", { name: "Show" }).click();
  await page.getByRole("link", { name: "Visual inspection of bracket welds" }).first().click();
  await expect(page.getByRole("link", { name: /Edit draft/ })).toHaveCount(0);
  await page.getByRole("link", { name: "Read published v2" }).click();
  await expect(page.getByTestId("version-content")).toContainText("Hot metal and wire brushing");
  await expect(page.getByTestId("procedure-note")).toContainText("never replace, the vehicle maker's specifications");
  await page.goto(page.url().replace(/versions\/2$/, "versions/3/edit"));
  await expect(page.getByRole("heading", { level: 1, name: "Only a lead edits procedures" })).toBeVisible();
});

test("importing a malformed file lists each problem and where it is", async ({ page }) => {
  await signedInAs(page, "lead@irongully.example");
  await page.goto("/procedures/import");
  const bad = { format: "gusset-procedure", formatVersion: 1, procedure: { title: "Broken" }, content: { sections: [{ key: "a", title: "Fit-up", steps: [{ key: "x", kind: "laser", title: "Zap" }] }] } };
  await page.getByLabel(/Procedure file/).setInputFiles({ name: "broken.gusset-procedure.json", mimeType: "application/json", buffer: Buffer.from(JSON.stringify(bad)) });
  await page.getByRole("button", { name: "Import as a new draft" }).click();
  await expect(page.getByTestId("import-error")).toContainText("Nothing was saved");
  await expect(page.getByTestId("import-problems")).toContainText("section 1 “Fit-up”, step 1 “Zap”, kind");
  await expect(page.getByTestId("import-problems")).toContainText("Unknown step kind");
});
