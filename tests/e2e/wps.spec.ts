import { expect, signedInAs, test } from "./support";

test("a lead publishes a new WPS revision and sees the qualification warnings", async ({ page }) => {
  await signedInAs(page, "lead@irongully.example");
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "WPS library" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "WPS library" })).toBeVisible();
  await page.getByTestId("wps-table").getByRole("link", { name: "GUS-GTAW-01" }).click();
  await expect(page.getByRole("heading", { level: 1 })).toContainText("GUS-GTAW-01");

  // A draft may be open from an earlier run on kept test data; otherwise start the next revision.
  const openDraft = page.getByTestId("edit-draft");
  if (await openDraft.isVisible()) await openDraft.click();
  else await page.getByRole("button", { name: /^Start revision \d+$/ }).click();
  await expect(page).toHaveURL(/\/wps\/[0-9a-f-]+\/revisions\/\d+\/edit$/);
  const number = Number(/revisions\/(\d+)\/edit/.exec(page.url())![1]);
  expect(number).toBeGreaterThanOrEqual(3);

  // A field error shows beside its field, and the rest of the draft is kept.
  const editor = page.getByTestId("draft-editor");
  await editor.getByLabel("Voltage, minimum", { exact: true }).fill("30");
  await editor.getByRole("button", { name: "Save draft" }).click();
  await expect(editor.getByText("The minimum voltage is above the maximum.")).toBeVisible();
  await editor.getByLabel("Voltage, minimum", { exact: true }).fill("10");
  await expect(editor.getByText("The minimum voltage is above the maximum.")).toHaveCount(0);
  await editor.getByLabel("Current, maximum", { exact: true }).fill("120");
  await editor.getByRole("button", { name: "Save draft" }).click();
  await expect(page.getByTestId("draft-ok")).toContainText(`Draft revision ${number} saved.`);
  await expect(editor.getByLabel("Current, maximum", { exact: true })).toHaveValue("120");

  const publish = page.getByTestId("publish-form");
  await publish.getByRole("button", { name: `Publish revision ${number}` }).click();
  await expect(publish.getByText("Say what changed in this revision.")).toBeVisible();
  await publish.getByLabel("Change note").fill("Maximum current cut to 120 A after burn-through on 1.2 mm wall.");
  await publish.getByRole("button", { name: `Publish revision ${number}` }).click();

  await expect(page).toHaveURL(new RegExp(`/wps/[0-9a-f-]+\\?published=${number}$`));
  await expect(page.getByTestId("published-ok")).toContainText(`Revision ${number} published.`);
  await expect(page.getByTestId("wps-state")).toContainText("Published");
  await expect(page.getByTestId("wps-state")).toContainText(`rev ${number}`);
  await expect(page.getByTestId("wps-amps")).toHaveText("70–120 A");
  await expect(page.getByTestId(`revision-${number}`)).toContainText("Published");
  await expect(page.getByTestId(`revision-${number}`)).toContainText("Maximum current cut to 120 A");
  await expect(page.getByTestId(`revision-${number - 1}`)).toContainText("Retired");
  await expect(page.getByTestId(`revision-${number - 1}`)).toContainText(`Superseded by revision ${number}.`);

  // Who may weld to it: the seeded GTAW welder lapses within 30 days, shown by word and shape.
  const warnings = page.getByTestId("qualification-warnings");
  await expect(warnings).toContainText("Welders qualified for GTAW");
  await expect(warnings).toContainText(/\d+ lapsing within 30 days/);
  await expect(warnings).toContainText("▲");
  await expect(warnings.getByRole("listitem").filter({ hasText: "Priya Okafor" })).toContainText(/Lapsing\s*in \d+ days?/);

  await page.goto("/qualifications?status=lapsing");
  const table = page.getByTestId("qualifications-table");
  const row = table.getByRole("row").filter({ hasText: "Priya Okafor" });
  await expect(row).toContainText("GTAW");
  await expect(row.getByTestId("continuity")).toHaveText(/▲\s*Lapsing/);
  await expect(table.getByRole("row").filter({ hasText: "Mick Tamsin" })).toHaveCount(0);
});

test("a lead adds a qualification: field errors inline, then the certificate upload and download", async ({ page }) => {
  await signedInAs(page, "lead@irongully.example");
  await page.goto("/qualifications/new");
  const form = page.getByTestId("qualification-form");
  await form.getByRole("button", { name: "Add the qualification" }).click();
  await expect(form.getByText("Choose the welder.")).toBeVisible();
  await expect(form.getByText("Tick the positions qualified.")).toBeVisible();
  await expect(form.getByText("Enter the filler F-No.")).toBeVisible();

  await form.getByLabel("Welder").selectOption({ label: "Mick Tamsin" });
  await form.getByLabel("Process", { exact: true }).selectOption("SMAW");
  await form.getByLabel("Thickness qualified, minimum").fill("5");
  await form.getByLabel("Thickness qualified, maximum").fill("3");
  await form.getByLabel("Filler F-No.").fill("4");
  await form.getByLabel("Test date").fill(new Date(Date.now() - 5 * 86_400_000).toISOString().slice(0, 10));
  await form.getByLabel("3G").check();
  await form.getByRole("button", { name: "Add the qualification" }).click();
  await expect(form.getByText("The minimum thickness is above the maximum.")).toBeVisible();
  await form.getByLabel("Thickness qualified, maximum").fill("20");
  await form.getByRole("button", { name: "Add the qualification" }).click();

  await expect(page).toHaveURL(/\/qualifications\/[0-9a-f-]+\?added=1$/);
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Mick Tamsin · SMAW");
  await expect(page.getByTestId("continuity-badge")).toHaveText(/●\s*Current/);
  await expect(page.getByTestId("certificate-missing")).toBeVisible();

  const upload = page.getByTestId("certificate-upload");
  await upload.getByLabel("Certificate file").setInputFiles({ name: "notes.txt", mimeType: "application/pdf", buffer: Buffer.from("not a certificate") });
  await upload.getByRole("button", { name: "Upload the certificate" }).click();
  await expect(page.getByTestId("certificate-error")).toContainText("a certificate is a PDF, or a JPEG or PNG photo of it");
  await upload.getByLabel("Certificate file").setInputFiles({ name: "smaw-3g.pdf", mimeType: "application/pdf", buffer: Buffer.from("%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n") });
  await upload.getByRole("button", { name: "Upload the certificate" }).click();
  await expect(page.getByTestId("certificate-ok")).toHaveText(/Certificate uploaded\./);
  await expect(page.getByTestId("certificate-present")).toContainText("smaw-3g.pdf");
  const download = page.waitForEvent("download");
  await page.getByRole("link", { name: "Download the certificate" }).click();
  expect((await download).suggestedFilename()).toBe("certificate-mick-tamsin-smaw.pdf");
});

test("a welder reads the WPS library and the qualifications but changes neither", async ({ page }) => {
  await signedInAs(page, "welder@irongully.example");
  const nav = page.getByRole("navigation", { name: "Main" });
  await expect(nav.getByRole("link", { name: "WPS library" })).toBeVisible();
  await expect(nav.getByRole("link", { name: "Qualifications" })).toBeVisible();
  await page.goto("/wps");
  await expect(page.getByTestId("wps-table")).toContainText("GUS-GMAW-02");
  await expect(page.getByTestId("start-wps-form")).toHaveCount(0);
  await page.getByTestId("wps-table").getByRole("link", { name: "GUS-GMAW-02" }).click();
  await expect(page.getByTestId("wps-preheat")).toHaveText("10 °C");
  await expect(page.getByRole("button", { name: /Start revision/ })).toHaveCount(0);
  await page.goto(`${page.url()}/revisions/1/edit`);
  await expect(page.getByTestId("denied")).toBeVisible();
  await page.goto("/qualifications");
  await expect(page.getByTestId("code-readonly")).toContainText("AWS D1.1");
  await expect(page.getByRole("link", { name: "Add a qualification" })).toHaveCount(0);
});
