// The axle job traveller: the printed record an auditor scans years later. It draws exactly what it is
// given (TravellerData) and looks nothing up, so the jobs code decides what the record says.
// react-pdf's Image has no alt text (the PDF is not tagged); the name keeps the HTML img lint rule off it.
import { Document, Image as PdfImage, Page, Path, Svg, Rect, Text, View, renderToBuffer, type PageProps, type TextProps } from "@react-pdf/renderer";
import type { ReactNode } from "react";
import { SAFETY_NOTE } from "@/lib/safety";
import { registerTravellerFonts } from "./fonts";
import { formatInstant, formatNumber, printableLines, formatSigned, groupHex, printable, sealShort, wrapUrl } from "./format";
import { GeometryDiagrams, SteeringWheelChart } from "./geometry-diagram";
import { Mark, Verdict, type MarkShape, type VerdictKind } from "./marks";
import { makeQr, type TravellerQr } from "./qr";
import { markerShapePath, MARKER_LOOK, seamPath, type MarkerState } from "@/lib/weld-map/marker";
import { COLOR, MARGIN, MIN_TEXT_PT, s } from "./theme";
import { parseTravellerData, type TravellerData, type TravellerJointState, type TravellerRecord, type TravellerJobState, type TravellerStepKind } from "./traveller-data";

export const HAZARD_LINE = "Hot work, fumes, cutting and grinding, coatings and steering components can hurt people.";
export const WIP_TITLE = "WORK IN PROGRESS \u2022 NOT RELEASED";
export const VOID_TITLE = "VOID \u2022 NOT RELEASED";

/** Page sizes in points (PDF user space units, 1/72 in): ISO 216 A4 and US Letter. */
export const PAGE_SIZE_PT = { a4: [595.28, 841.89], letter: [612, 792] } as const;

const STATE_LOOK: Record<TravellerJobState, { word: string; shape: MarkShape }> = {
  planned: { word: "Planned", shape: "ring" },
  in_progress: { word: "In progress", shape: "dash" },
  on_hold: { word: "On hold", shape: "triangle" },
  ready_for_release: { word: "Ready for release", shape: "square" },
  released: { word: "Released", shape: "dot" },
  void: { word: "Void", shape: "cross" },
};

const KIND_WORD: Record<TravellerStepKind, string> = {
  check: "Check",
  measure: "Measurement",
  photo: "Photos",
  caution: "Safety caution",
  weld: "Weld",
  hold: "Hold point",
  torque: "Torque",
  coating: "Coating",
  geometry: "Steering geometry",
};

const MEANING_WORD = { performed: "Performed", inspected: "Inspected", dispositioned: "Dispositioned", released: "Released" } as const;
const DISPOSITION_WORD = { rework: "Rework", repair: "Repair", use_as_is: "Use as is", scrap: "Scrap" } as const;

type Ctx = { d: TravellerRecord; tz: string; refs: Map<string, string>; amendedBy: Map<string, string[]>; contentWidth: number; qr: TravellerQr };

const P = (text: string) => printable(text);
const cap = (t: string) => (t ? t.charAt(0).toUpperCase() + t.slice(1) : t);
const when = (c: Ctx, d: Date | null | undefined) => (d ? formatInstant(d, c.tz) : "\u2014");

// ───────────────────────────── page chrome (every page, from the Page layout template) ─────────────────────────────

function Header({ c, pageNumber, totalPages }: { c: Ctx; pageNumber?: number; totalPages?: number }) {
  return (
    <View style={s.header}>
      <View style={s.headerRow}>
        <View style={{ flex: 1 }}>
          <Text style={s.headerShop}>{P(c.d.shopName)}</Text>
          <Text style={s.label}>Axle job traveller</Text>
        </View>
        <View style={s.headerField}>
          <Text style={s.label}>Job</Text>
          <Text style={s.headerValue}>{P(c.d.jobNumber)}</Text>
        </View>
        <View style={s.headerField}>
          <Text style={s.label}>Axle tag</Text>
          <Text style={s.headerValue}>{P(c.d.axle.idTag) || "\u2014"}</Text>
        </View>
        <View style={[s.headerField, { minWidth: 70 }]}>
          <Text style={s.label}>Sheet</Text>
          <Text style={s.headerValue}>{`Page ${pageNumber ?? "?"} of ${totalPages ?? "?"}`}</Text>
        </View>
      </View>
      <View style={s.headerRule}>
        <View style={{ width: 44, backgroundColor: COLOR.primer }} />
        <View style={{ flex: 1, backgroundColor: COLOR.ink }} />
      </View>
    </View>
  );
}

// Chrome is built from plain boxes and texts: react-pdf's page template does not draw Svg.
function WipBanner({ c }: { c: Ctx }) {
  const isVoid = c.d.state === "void";
  const sub = isVoid
    ? "This job was voided. The record is kept as it stood; nothing on it is released."
    : `State: ${STATE_LOOK[c.d.state].word}. A snapshot of an open job, not a release record: steps, welds and the seal may still change.`;
  return (
    <View style={s.wip}>
      <View style={s.wipBlock}>
        <Text style={s.wipText}>{isVoid ? VOID_TITLE : WIP_TITLE}</Text>
      </View>
      <View style={s.wipSubBox}>
        <Text style={s.wipSub}>{sub}</Text>
      </View>
    </View>
  );
}

function Footer({ c }: { c: Ctx }) {
  return (
    <View style={s.footer}>
      <Text>
        Seal <Text style={[s.mono, { color: COLOR.ink }]}>{sealShort(c.d.seal.sha256)}</Text> {"\u00b7"} {c.d.seal.entries} record entries
      </Text>
      <Text>Printed {when(c, c.d.printedAt)}</Text>
      <Text>Gusset {"\u00b7"} sign-offs are electronic signatures</Text>
    </View>
  );
}

// ───────────────────────────── building blocks ─────────────────────────────

function SectionHead({ n, title, first = false }: { n: number | string; title: string; first?: boolean }) {
  return (
    <View style={[s.sectionHead, first ? { marginTop: 0 } : {}]} wrap={false}>
      <View style={s.accentTick} />
      <Text style={s.sectionNo}>{String(n).padStart(2, "0")}</Text>
      <Text style={s.sectionTitle}>{title}</Text>
    </View>
  );
}

function KV({ label, children }: { label: string; children: ReactNode }) {
  return (
    <View style={s.kvRow} wrap={false}>
      <Text style={[s.label, s.kvLabel]}>{label}</Text>
      <View style={s.kvValue}>{children}</View>
    </View>
  );
}

type Col = { title: string; flex: number; align?: "left" | "right" };

function TableHead({ cols }: { cols: Col[] }) {
  return (
    <View style={s.th}>
      {cols.map((col) => (
        <Text key={col.title} style={[s.label, s.cell, { flex: col.flex, textAlign: col.align ?? "left" }]}>
          {col.title}
        </Text>
      ))}
    </View>
  );
}

function Cell({ flex, children, align }: { flex: number; children: ReactNode; align?: "left" | "right" }) {
  return <View style={[s.cell, { flex, alignItems: align === "right" ? "flex-end" : "flex-start" }]}>{children}</View>;
}

function None({ children }: { children: string }) {
  return <Text style={[s.muted, { marginTop: 2 }]}>{children}</Text>;
}

/** A section whose heading never sits alone at a page foot: heading, column heads and first row stay together. */
function KeptTable({ head, cols, rows, empty }: { head: ReactNode; cols: Col[]; rows: ReactNode[]; empty: string }) {
  if (rows.length === 0) {
    return (
      <View wrap={false}>
        {head}
        <None>{empty}</None>
      </View>
    );
  }
  const [firstRow, ...rest] = rows;
  return (
    <View>
      <View wrap={false}>
        {head}
        <View style={s.table}>
          <TableHead cols={cols} />
          {firstRow}
        </View>
      </View>
      {rest}
    </View>
  );
}

// ───────────────────────────── page 1: the record ─────────────────────────────

function QrCode({ qr }: { qr: TravellerQr }) {
  // The white square includes the 4-module quiet zone (ISO/IEC 18004); nothing else is drawn inside it.
  return (
    <Svg width={qr.widthPt} height={qr.widthPt} viewBox={`0 0 ${qr.viewBoxSize} ${qr.viewBoxSize}`}>
      <Rect x={0} y={0} width={qr.viewBoxSize} height={qr.viewBoxSize} fill={COLOR.white} />
      <Path d={qr.path} fill="#000000" />
    </Svg>
  );
}

function SealPanel({ c }: { c: Ctx }) {
  const full = groupHex(c.d.seal.sha256, 4);
  const lines = [0, 4, 8, 12].map((i) => full.slice(i, i + 4).join(" "));
  return (
    <View style={s.sealPanel}>
      <Text style={[s.label, { marginBottom: 2 }]}>Verify this record</Text>
      <QrCode qr={c.qr} />
      <View style={{ marginTop: 1, alignItems: "center" }}>
        {wrapUrl(c.d.verifyUrl, 32).map((line, i) => (
          <Text key={i} style={[s.mono, { fontSize: MIN_TEXT_PT, color: COLOR.ink }]}>
            {P(line)}
          </Text>
        ))}
      </View>
      <View style={{ alignSelf: "stretch", borderTopWidth: 0.75, borderTopColor: COLOR.ruleStrong, marginTop: 8, paddingTop: 6, alignItems: "center" }}>
        <Text style={s.label}>Seal</Text>
        <Text style={s.sealShort}>{sealShort(c.d.seal.sha256)}</Text>
        <View style={{ marginTop: 3 }}>
          {lines.map((l, i) => (
            <Text key={i} style={s.sealFull}>
              {l}
            </Text>
          ))}
        </View>
        <Text style={[s.tiny, { marginTop: 4, color: COLOR.body, textAlign: "center" }]}>
          SHA-256 head of {c.d.seal.entries} record entries. Scanning checks the stored record still hashes to this seal.
        </Text>
      </View>
    </View>
  );
}

function StateBadge({ state }: { state: TravellerJobState }) {
  const look = STATE_LOOK[state];
  return (
    <View style={s.badge}>
      <Mark shape={look.shape} size={7} />
      <Text style={s.badgeText}>{look.word}</Text>
    </View>
  );
}

function Stat({ label, value, sub, last = false }: { label: string; value: string; sub: string; last?: boolean }) {
  return (
    <View style={[s.stat, last ? { marginRight: 0 } : {}]}>
      <Text style={s.label}>{label}</Text>
      <Text style={s.statValue}>{value}</Text>
      <Text style={[s.tiny, { color: COLOR.body }]}>{sub}</Text>
    </View>
  );
}

type Person = { name: string; roles: Set<string>; meanings: Map<string, number>; welded: string[]; inspected: number; overrides: number; ncs: number };

/** Everyone whose name is on the record, with what they signed: a signature manifest for the auditor. */
function People({ c }: { c: Ctx }) {
  const people = new Map<string, Person>();
  const get = (name: string) => {
    let p = people.get(name);
    if (!p) people.set(name, (p = { name, roles: new Set(), meanings: new Map(), welded: [], inspected: 0, overrides: 0, ncs: 0 }));
    return p;
  };
  for (const sec of c.d.sections)
    for (const st of sec.steps)
      for (const so of st.signOffs) {
        const p = get(so.printedName);
        p.roles.add(cap(so.role));
        p.meanings.set(so.meaning, (p.meanings.get(so.meaning) ?? 0) + 1);
      }
  for (const w of c.d.welds) {
    const welders = new Set(w.rounds.flatMap((r) => r.passes.filter((p) => !p.struckOut).map((p) => p.welderName)));
    for (const name of welders) get(name).welded.push(w.jointId);
    for (const r of w.rounds) {
      if (r.inspection) get(r.inspection.inspectorName).inspected++;
      for (const p of r.passes) if (p.override) get(p.override.by).overrides++;
    }
  }
  for (const n of c.d.nonconformances) {
    if (n.raisedBy) get(n.raisedBy).ncs++;
    if (n.dispositionedBy) {
      const p = get(n.dispositionedBy);
      p.ncs++;
      p.meanings.set("dispositioned", (p.meanings.get("dispositioned") ?? 0) + 1);
    }
  }
  if (c.d.release) {
    const p = get(c.d.release.printedName);
    p.roles.add(cap(c.d.release.role));
    p.meanings.set("released", (p.meanings.get("released") ?? 0) + 1);
  }
  if (people.size === 0) return null;
  const cols: Col[] = [
    { title: "Printed name", flex: 1.3 },
    { title: "Signed as", flex: 1 },
    { title: "Sign-offs", flex: 1.6 },
    { title: "Also on the record", flex: 2 },
  ];
  return (
    <View style={{ marginTop: 16 }}>
      <Text style={s.subHead}>People on this record</Text>
      <View style={s.table}>
        <TableHead cols={cols} />
        {[...people.values()].map((p) => {
          const also = [
            p.welded.length ? `welded ${p.welded.join(", ")}` : "",
            p.inspected ? `${p.inspected} weld inspection${p.inspected === 1 ? "" : "s"}` : "",
            p.overrides ? `${p.overrides} pass override${p.overrides === 1 ? "" : "s"}` : "",
            p.ncs ? `${p.ncs} nonconformance entr${p.ncs === 1 ? "y" : "ies"}` : "",
          ].filter(Boolean);
          return (
            <View key={p.name} style={s.tr} wrap={false}>
              <Cell flex={1.3}>
                <Text style={s.bold}>{P(p.name)}</Text>
              </Cell>
              <Cell flex={1}>
                <Text>{P([...p.roles].join(", ")) || "\u2014"}</Text>
              </Cell>
              <Cell flex={1.6}>
                <Text>{[...p.meanings].map(([m, n]) => `${MEANING_WORD[m as keyof typeof MEANING_WORD]} ${n}`).join(" \u00b7 ") || "\u2014"}</Text>
              </Cell>
              <Cell flex={2}>
                <Text style={{ color: COLOR.body }}>{P(also.join("; ")) || "\u2014"}</Text>
              </Cell>
            </View>
          );
        })}
      </View>
    </View>
  );
}

function RecordPage({ c }: { c: Ctx }) {
  const { d } = c;
  const steps = d.sections.flatMap((x) => x.steps);
  const signed = steps.filter((st) => st.signOffs.length > 0).length;
  const accepted = d.welds.filter((w) => jointStateOf(w) === "accepted").length;
  const open = d.nonconformances.filter((n) => n.disposition === null).length;
  const vehicle = [d.vehicle.year ?? "", d.vehicle.makeModel].filter((x) => x !== "").join(" ");
  return (
    <View>
      <View style={s.row}>
        <View style={{ flex: 1 }}>
          <Text style={s.label}>Job number</Text>
          <Text style={s.jobNumber}>{P(d.jobNumber)}</Text>
          <StateBadge state={d.state} />
          <View style={{ marginTop: 12 }}>
            <KV label="Customer">
              <Text>{P(d.customerName)}</Text>
            </KV>
            <KV label="Vehicle">
              <Text>{P(vehicle) || "\u2014"}</Text>
            </KV>
            <KV label="VIN">
              <Text style={[s.mono, { letterSpacing: 0.4 }]}>{P(d.vehicle.vin) || "\u2014"}</Text>
              {d.vehicle.vinCheckDigitWarning ? (
                <View style={{ flexDirection: "row", alignItems: "center", marginTop: 1.5 }}>
                  <Mark shape="triangle" color={COLOR.warn} size={7} />
                  <Text style={[s.small, { marginLeft: 3, color: COLOR.warn, fontWeight: 600 }]}>
                    Check digit does not match (49 CFR 565.15); recorded as read, confirm on the vehicle.
                  </Text>
                </View>
              ) : null}
            </KV>
            <KV label="Axle">
              <Text>{P(d.axle.description) || "\u2014"}</Text>
            </KV>
            <KV label="Axle ID tag">
              <Text style={s.mono}>{P(d.axle.idTag) || "\u2014"}</Text>
            </KV>
            <KV label="Procedure">
              <Text>
                {P(d.procedure.title)}
                <Text style={[s.mono, s.bold]}>{`  v${d.procedure.version}`}</Text>
              </Text>
              <Text style={[s.mono, s.tiny, { color: COLOR.body, marginTop: 1 }]}>content {groupHex(d.procedure.contentHash, 8).join(" ")}</Text>
            </KV>
            <KV label="Created">
              <Text style={s.mono}>{when(c, d.dates.created)}</Text>
            </KV>
            <KV label="Due">
              <Text style={s.mono}>{d.dates.due ?? "\u2014"}</Text>
            </KV>
            <KV label="Released">
              <Text style={s.mono}>{d.dates.released ? when(c, d.dates.released) : "not released"}</Text>
              {d.release ? (
                <Text style={[s.small, { marginTop: 1 }]}>
                  <Text style={s.bold}>Released</Text>
                  {"  "}
                  {P(d.release.printedName)} {"\u00b7"} {P(cap(d.release.role))} {"\u00b7"} <Text style={s.mono}>{when(c, d.release.signedAt)}</Text>
                </Text>
              ) : null}
            </KV>
          </View>
        </View>
        <SealPanel c={c} />
      </View>

      <View style={s.stats}>
        <Stat label="Steps signed" value={`${signed} / ${steps.length}`} sub={`${d.sections.length} sections`} />
        <Stat label="Weld joints" value={String(d.welds.length)} sub={`${accepted} accepted at their last inspection`} />
        <Stat label="Nonconformances" value={String(d.nonconformances.length)} sub={open === 0 ? "none open" : `${open} open`} />
        <Stat label="Photos" value={String(d.photos.length)} sub="contact sheet at the end" last />
      </View>

      <People c={c} />

      <View style={[s.safety, { marginTop: 18 }]} wrap={false}>
        <Svg width={16} height={15} viewBox="0 0 16 15">
          <Path d="M8 0.8 L15.4 14.2 L0.6 14.2 Z" fill={COLOR.white} stroke={COLOR.ink} strokeWidth={1.4} />
          <Rect x={7.2} y={5} width={1.6} height={5} fill={COLOR.ink} />
          <Rect x={7.2} y={11.2} width={1.6} height={1.6} fill={COLOR.ink} />
        </Svg>
        <View style={{ flex: 1, marginLeft: 10 }}>
          <Text style={{ fontWeight: 700 }}>Check before you rely on it.</Text>
          <Text>
            {HAZARD_LINE} {SAFETY_NOTE}
          </Text>
        </View>
      </View>

      <View style={{ marginTop: 12 }}>
        <Text style={[s.small, { color: COLOR.body }]}>
          How to read this traveller: each sign-off shows the signer&apos;s printed name, role, what the signature means and when it was made
          (21 CFR 11.50). Signed entries are never changed; a correction is a new sign-off that names the one it amends and why. Times are
          shown in {c.tz === "UTC" ? "UTC" : `${c.tz} with their UTC offset`}.
        </Text>
      </View>
    </View>
  );
}

// ───────────────────────────── checklist ─────────────────────────────

type StepRec = TravellerRecord["sections"][number]["steps"][number];

// The checklist is most of the document, so its blocks use as few layout nodes as they can: one
// paragraph per sign-off (nested spans are free), plain boxes for marks.
function SignOffLine({ c, so }: { c: Ctx; so: StepRec["signOffs"][number] }) {
  const later = c.amendedBy.get(so.id);
  const line = (
    <Text style={s.signOff}>
      <Text style={s.signRef}>{`${c.refs.get(so.id) ?? ""}   `}</Text>
      <Text style={s.bold}>{MEANING_WORD[so.meaning]}</Text>
      {"  "}
      {P(so.printedName)} {"\u00b7"} {P(cap(so.role))} {"\u00b7"} <Text style={[s.mono, s.small]}>{when(c, so.signedAt)}</Text>
      {so.round === undefined ? null : <Text style={s.small}>{` \u00b7 round ${so.round}`}</Text>}
      {later ? <Text style={[s.small, s.muted]}>{`   amended by ${later.join(", ")}`}</Text> : null}
    </Text>
  );
  if (!so.amends) return line;
  return (
    <View>
      {line}
      <Text style={[s.small, { color: COLOR.ink2, marginLeft: 22 }]}>
        <Text style={s.bold}>{`Amends ${c.refs.get(so.amends.signOffId) ?? "?"}: `}</Text>
        {P(so.amends.reason)}
      </Text>
    </View>
  );
}

/** Free text that may hold line breaks: one Text per line (a line feed inside a Text would be drawn in Helvetica). */
function Para({ text, style }: { text: string; style?: TextProps["style"] }) {
  const lines = printableLines(text);
  if (lines.length <= 1) return <Text style={style}>{lines[0] ?? ""}</Text>;
  return (
    <View>
      {lines.map((l, i) => (
        <Text key={i} style={style}>
          {l || " "}
        </Text>
      ))}
    </View>
  );
}

const MEAS_COLS = { label: 1.6, value: 1, tol: 1.6 } as const;

function Measurements({ ms }: { ms: StepRec["measurements"] }) {
  if (ms.length === 0) return null;
  return (
    <View style={s.measures}>
      <View style={s.row}>
        <Text style={[s.label, { flex: MEAS_COLS.label }]}>Reading</Text>
        <Text style={[s.label, { flex: MEAS_COLS.value, textAlign: "right", paddingRight: 10 }]}>Measured</Text>
        <Text style={[s.label, { flex: MEAS_COLS.tol }]}>Tolerance</Text>
        <Text style={[s.label, { width: 44 }]}>Verdict</Text>
      </View>
      {ms.map((m, i) => (
        <View key={i} style={s.measureRow}>
          <Text style={{ flex: MEAS_COLS.label }}>{P(m.label ?? "") || "\u2014"}</Text>
          <Text style={[s.mono, { flex: MEAS_COLS.value, textAlign: "right", paddingRight: 10 }]}>
            {formatNumber(m.value, m.decimals)}
            {m.unit === "\u00b0" ? "\u00b0" : ` ${P(m.unit)}`}
          </Text>
          <Text style={[s.mono, s.small, { flex: MEAS_COLS.tol }]}>{P(m.toleranceText) || "\u2014"}</Text>
          <Verdict kind={m.verdict} width={44} />
        </View>
      ))}
    </View>
  );
}

function StepBlock({ c, st, no }: { c: Ctx; st: StepRec; no: string }) {
  const signed = st.signOffs.length > 0;
  return (
    <View style={s.step} wrap={false}>
      <View style={s.stepHead}>
        <Text style={s.stepNo}>{no}</Text>
        <Text style={s.stepTitle}>
          {P(st.title)}
          <Text style={s.stepKey}>{`   ${P(st.key)}`}</Text>
        </Text>
        <Text style={s.stepKind}>{KIND_WORD[st.kind]}</Text>
        <Verdict kind={signed ? "signed" : "open"} width={46} />
      </View>
      <View style={s.stepBody}>
        {st.resultText ? <Para style={s.result} text={st.resultText} /> : null}
        <Measurements ms={st.measurements} />
        {signed ? st.signOffs.map((so) => <SignOffLine key={so.id} c={c} so={so} />) : <Text style={[s.signOff, s.muted]}>Not signed yet.</Text>}
      </View>
    </View>
  );
}

function Checklist({ c }: { c: Ctx }) {
  return (
    <View>
      <SectionHead n={2} title="Checklist" first />
      {c.d.sections.length === 0 ? <None>No steps on this job.</None> : null}
      {c.d.sections.map((sec, si) => (
        <View key={sec.key}>
          {sec.steps.map((st, ti) =>
            ti === 0 ? (
              // The section title travels with its first step.
              <View key={st.key} wrap={false}>
                <Text style={s.checklistSection}>
                  <Text style={s.mono}>{`${si + 1}   `}</Text>
                  {P(sec.title)}
                </Text>
                <StepBlock c={c} st={st} no={`${si + 1}.${ti + 1}`} />
              </View>
            ) : (
              <StepBlock key={st.key} c={c} st={st} no={`${si + 1}.${ti + 1}`} />
            ),
          )}
        </View>
      ))}
    </View>
  );
}

// ───────────────────────────── geometry ─────────────────────────────

type Capture = NonNullable<NonNullable<TravellerRecord["geometry"]>["before"]>;

function GeometrySection({ c, first = false }: { c: Ctx; first?: boolean }) {
  const g = c.d.geometry;
  const before = g?.before ?? null;
  const after = g?.after ?? null;
  const yz = (p: { y: number; z: number }) => `${formatNumber(p.y, 1)} / ${formatNumber(p.z, 1)}`;
  const rows: { label: string; unit: string; get: (x: Capture) => string }[] = [
    { label: "Lateral link, frame end F", unit: "y / z mm", get: (x) => yz(x.lateralLink.frameEnd) },
    { label: "Lateral link, axle end A", unit: "y / z mm", get: (x) => yz(x.lateralLink.axleEnd) },
    { label: "Drag link, pitman end P", unit: "y / z mm", get: (x) => yz(x.dragLink.pitmanEnd) },
    { label: "Drag link, steering-arm end K", unit: "y / z mm", get: (x) => yz(x.dragLink.knuckleEnd) },
    { label: "Axle centre C", unit: "y / z mm", get: (x) => yz(x.axleCenter) },
    { label: "Lateral link angle", unit: "deg", get: (x) => formatSigned(x.lateralLinkAngleDeg, 2) },
    { label: "Drag link angle", unit: "deg", get: (x) => formatSigned(x.dragLinkAngleDeg, 2) },
    {
      label: "Worst wheel steer",
      unit: "deg",
      get: (x) => formatSigned(x.worstWheelSteerDeg, 2) + (x.worstAtTravelMm === undefined ? "" : ` at ${formatSigned(x.worstAtTravelMm, 0)} mm`),
    },
    { label: "Travel range checked", unit: "", get: (x) => P(x.travelText ?? "") || "\u2014" },
  ];
  const cols: Col[] = [
    { title: "Quantity", flex: 2.2 },
    { title: "Unit", flex: 0.8 },
    { title: "Before", flex: 1.5, align: "right" },
    { title: "After", flex: 1.5, align: "right" },
  ];
  return (
    <View>
      {!before && !after ? (
        <View wrap={false}>
          <SectionHead n={3} title="Steering geometry" first={first} />
          <None>No geometry captured on this job.</None>
        </View>
      ) : (
        <View>
          <View wrap={false}>
            <SectionHead n={3} title="Steering geometry" first={first} />
            <View style={s.table}>
            <TableHead cols={cols} />
            {rows.map((r) => (
              <View key={r.label} style={s.tr}>
                <Cell flex={2.2}>
                  <Text>{r.label}</Text>
                </Cell>
                <Cell flex={0.8}>
                  <Text style={[s.small, s.muted]}>{r.unit}</Text>
                </Cell>
                <Cell flex={1.5} align="right">
                  <Text style={s.mono}>{before ? r.get(before) : "not captured"}</Text>
                </Cell>
                <Cell flex={1.5} align="right">
                  <Text style={s.mono}>{after ? r.get(after) : "not captured"}</Text>
                </Cell>
              </View>
            ))}
            </View>
          </View>
          <GeometryDiagrams before={before} after={after} width={c.contentWidth} />
          <SteeringWheelChart before={before} after={after} width={c.contentWidth} />
          {g?.roadTestNote ? (
            <View wrap={false} style={{ marginTop: 6 }}>
              <Text style={s.small}>{P(g.roadTestNote)}</Text>
            </View>
          ) : null}
        </View>
      )}
    </View>
  );
}

// ───────────────────────────── welds ─────────────────────────────

type WeldRec = TravellerRecord["welds"][number];
type RoundRec = WeldRec["rounds"][number];

const JOINT_LOOK: Record<TravellerJointState, { word: string; kind: VerdictKind }> = {
  welding: { word: "welding", kind: "open" },
  awaiting_inspection: { word: "waiting for inspection", kind: "waiting" },
  repair: { word: "in repair", kind: "warn" },
  accepted: { word: "accepted", kind: "accept" },
};

/** Where a joint stands, as the caller said or as its last round shows. */
export function jointStateOf(w: Pick<WeldRec, "state" | "rounds">): TravellerJointState {
  if (w.state) return w.state;
  const last = w.rounds.at(-1);
  if (!last) return "welding";
  if (last.inspection?.result === "accept") return "accepted";
  if (last.inspection?.result === "reject") return "repair";
  return last.passes.length ? "awaiting_inspection" : last.round > 1 ? "repair" : "welding";
}

const WELD_COLS: Col[] = [
  { title: "Joint", flex: 1.2 },
  { title: "Welder", flex: 1.15 },
  { title: "WPS", flex: 1.1 },
  { title: "Filler / lot", flex: 1.2 },
  { title: "Preheat \u00b0C", flex: 0.7, align: "right" },
  { title: "Heat input kJ/mm", flex: 0.85, align: "right" },
  { title: "Against WPS", flex: 0.85 },
  { title: "Joint state", flex: 1.15 },
];

// The passes and the inspection of one round, indented under the joint: one paragraph per pass (nested
// spans cost no layout) with its heat input and verdict beside it.
function RoundBlock({ c, r }: { c: Ctx; r: RoundRec }) {
  const i = r.inspection;
  return (
    <View style={s.round}>
      <Text style={s.roundHead}>
        {`Round ${r.round}`}
        <Text style={[s.muted, { fontWeight: 400 }]}>{r.round > 1 ? "  repair after rejection" : "  first welding"}</Text>
      </Text>
      {r.passes.length === 0 ? <Text style={[s.tiny, s.muted]}>No passes recorded in this round.</Text> : null}
      {r.passes.map((p) => (
        <View key={p.passNumber}>
          <View style={[s.row, { alignItems: "center" }]}>
            <Text style={[s.small, { flex: 1 }, p.struckOut ? { color: COLOR.muted } : {}]}>
              <Text style={[s.mono, s.bold]}>{`Pass ${p.passNumber}  `}</Text>
              {P(p.welderName)} {"\u00b7"} <Text style={s.mono}>{P(p.wpsRef)}</Text>
              {p.wpsRevision === null ? " (no published revision)" : ` rev ${p.wpsRevision}`}
            </Text>
            <Text style={[s.mono, s.small, { width: 160, textAlign: "right", paddingRight: 6 }]}>
              {`heat input ${formatNumber(p.heatInputKJPerMm, 2)} kJ/mm${p.heatInputMaxKJPerMm === undefined ? "" : ` (max ${formatNumber(p.heatInputMaxKJPerMm, 2)})`}`}
            </Text>
            <View style={{ width: 78 }}>
              {p.struckOut ? <Verdict kind="na" word="struck out" /> : <Verdict kind={p.heatInputVerdict} word={p.heatInputVerdict === "na" ? "no WPS limit" : undefined} />}
            </View>
          </View>
          {p.outOfRange.map((m, k) => (
            <Text key={k} style={[s.tiny, { marginLeft: 34, color: COLOR.fail }]}>
              {`Outside the WPS: ${P(m)}`}
            </Text>
          ))}
          {p.override ? (
            <Text style={[s.tiny, { marginLeft: 34, color: COLOR.ink2 }]}>
              <Text style={s.bold}>Accepted by lead override</Text> {P(p.override.by)} {"\u00b7"} <Text style={s.mono}>{when(c, p.override.at)}</Text>: {P(p.override.reason)}
            </Text>
          ) : null}
        </View>
      ))}
      {i ? (
        <View style={{ marginTop: 1.5 }}>
          <View style={[s.row, { alignItems: "center" }]}>
            <Text style={[s.small, s.bold, { marginRight: 4 }]}>{`Inspection round ${i.round}`}</Text>
            <Verdict kind={i.result} />
            <Text style={[s.small, { marginLeft: 4, flex: 1 }]}>
              {P(i.inspectorName)} {"\u00b7"} <Text style={s.mono}>{when(c, i.at)}</Text>
              {i.criteria ? <Text style={s.muted}>{` \u00b7 ${P(i.criteria)}`}</Text> : null}
            </Text>
          </View>
          {i.rejected.map((x, k) => (
            <Text key={k} style={[s.tiny, { marginLeft: 34, color: COLOR.ink2 }]}>
              <Text style={[s.bold, { color: COLOR.fail }]}>{`${cap(P(x.item))}: `}</Text>
              {`measured ${P(x.measured)}; limit ${P(x.limit)}`}
            </Text>
          ))}
          {i.note ? <Para style={[s.tiny, { marginLeft: 34, color: COLOR.body }]} text={`Notes: ${i.note}`} /> : null}
        </View>
      ) : (
        <View style={[s.row, { alignItems: "center", marginTop: 1.5 }]}>
          <Text style={[s.small, s.bold, { marginRight: 4 }]}>{`Inspection round ${r.round}`}</Text>
          <Verdict kind="open" word="not inspected yet" />
        </View>
      )}
    </View>
  );
}

function WeldRow({ c, w }: { c: Ctx; w: WeldRec }) {
  const look = JOINT_LOOK[jointStateOf(w)];
  const passCount = w.rounds.reduce((n, r) => n + r.passes.length, 0);
  // A joint with a long pass list may break across pages; a normal one stays whole.
  return (
    <View style={s.tr} wrap={passCount > 24}>
      <View style={{ flex: 1 }}>
        <View style={s.row}>
          <Cell flex={1.2}>
            <Text style={[s.mono, s.bold]}>{P(w.jointId)}</Text>
            {w.location ? <Text style={[s.tiny, { color: COLOR.body }]}>{P(w.location)}</Text> : null}
          </Cell>
          <Cell flex={1.15}>
            <Text>{P(w.welderName)}</Text>
            {w.process || w.passes !== undefined ? (
              <Text style={[s.tiny, s.muted]}>{[P(w.process), w.passes === undefined ? "" : `${w.passes} pass${w.passes === 1 ? "" : "es"}`].filter(Boolean).join(" \u00b7 ")}</Text>
            ) : null}
          </Cell>
          <Cell flex={1.1}>
            <Text style={[s.mono, s.small]}>{P(w.wpsRef)}</Text>
          </Cell>
          <Cell flex={1.2}>
            <Text>{P(w.filler)}</Text>
            <Text style={[s.mono, s.tiny, { color: COLOR.body }]}>lot {P(w.fillerLot)}</Text>
          </Cell>
          <Cell flex={0.7} align="right">
            <Text style={s.mono}>{w.preheatC === null ? "\u2014" : formatNumber(w.preheatC, 0)}</Text>
          </Cell>
          <Cell flex={0.85} align="right">
            <Text style={[s.mono, s.bold]}>{formatNumber(w.heatInputKJPerMm, 2)}</Text>
            {w.heatInputMaxKJPerMm !== undefined ? <Text style={[s.mono, s.tiny, s.muted]}>max {formatNumber(w.heatInputMaxKJPerMm, 2)}</Text> : null}
          </Cell>
          <Cell flex={0.85}>
            <Verdict kind={w.heatInputVerdict} word={w.heatInputVerdict === "na" ? "no WPS limit" : w.heatInputVerdict} />
          </Cell>
          <Cell flex={1.15}>
            <Verdict kind={look.kind} word={look.word} />
            <Text style={[s.tiny, s.muted]}>{`${w.rounds.length} round${w.rounds.length === 1 ? "" : "s"}`}</Text>
          </Cell>
        </View>
        {w.rounds.map((r) => (
          <RoundBlock key={r.round} c={c} r={r} />
        ))}
      </View>
    </View>
  );
}

function WeldSection({ c }: { c: Ctx }) {
  return (
    <KeptTable
      head={<SectionHead n={4} title="Welds and inspection" />}
      cols={WELD_COLS}
      empty="No weld joints recorded on this job."
      rows={c.d.welds.map((w) => (
        <WeldRow key={w.jointId} c={c} w={w} />
      ))}
    />
  );
}

// ───────────────────────────── weld map ─────────────────────────────

// The embedded fonts have no ● ◆ ▲ ■: the legend and the table draw each state's marker as the map does.
function MapMark({ state, size = 9 }: { state: MarkerState; size?: number }) {
  return (
    <Svg width={size} height={size} viewBox="0 0 20 20">
      <Path d={markerShapePath(MARKER_LOOK[state].shape, 10, 10, 6.5)} fill={state === "accepted" ? COLOR.ink : COLOR.white} stroke={COLOR.ink} strokeWidth={2.2} />
    </Svg>
  );
}

const LEGEND: MarkerState[] = ["welding", "awaiting_inspection", "repair", "accepted"];

/** Each image once with every joint on it marked (shape by state) and labelled, then the list of joints. */
function WeldMapSection({ c }: { c: Ctx }) {
  const map = c.d.weldMap;
  if (!map) return null;
  const maxH = 320; // heading, legend, image and its caption on one page at 8 pt text
  const image = (img: (typeof map.images)[number], n: number) => {
        let w = c.contentWidth;
        let h = (w * img.height) / img.width;
        if (h > maxH) {
          w = (w * maxH) / h;
          h = maxH;
        }
        const joints = map.joints.filter((j) => j.imageId === img.id);
        const r = 6;
        return (
          <View key={img.id} wrap={false} style={{ marginBottom: 10 }}>
            <Text style={[s.label, { marginBottom: 3 }]}>{`Image ${n + 1}${img.label ? ` \u00b7 ${P(img.label)}` : ""}${img.sha256 ? `  #${img.sha256.slice(0, 8)}` : ""}`}</Text>
            <View style={{ width: w, height: h, position: "relative", borderWidth: 0.5, borderColor: COLOR.ruleStrong }}>
              <PdfImage src={{ data: img.image, format: img.image[0] === 0x89 ? "png" : "jpg" }} style={{ width: w, height: h }} />
              <Svg width={w} height={h} viewBox={`0 0 ${w} ${h}`} style={{ position: "absolute", left: 0, top: 0 }}>
                {joints.map((j) =>
                  j.path ? <Path key={`p-${j.jointId}`} d={seamPath(j.path, w, h)} stroke={COLOR.ink} strokeWidth={2.5} fill="none" strokeDasharray="5 3" /> : null,
                )}
                {joints.map((j) => (
                  <Path key={`m-${j.jointId}`} d={markerShapePath(MARKER_LOOK[j.state].shape, j.x * w, j.y * h, r)} fill={j.state === "accepted" ? COLOR.ink : COLOR.white} stroke={COLOR.ink} strokeWidth={1.5} />
                ))}
              </Svg>
              {joints.map((j) => (
                <View key={`l-${j.jointId}`} style={{ position: "absolute", left: Math.min(w - 34, j.x * w + r + 2), top: Math.max(0, j.y * h - r - 12), backgroundColor: COLOR.white, borderWidth: 0.75, borderColor: COLOR.ink, paddingHorizontal: 2 }}>
                  <Text style={[s.mono, s.bold, { fontSize: 8, color: COLOR.ink }]}>{j.jointId}</Text>
                </View>
              ))}
            </View>
          </View>
        );
      };
  return (
    <View break>
      {/* The heading stays on the page of the first image. */}
      <View wrap={false}>
        <SectionHead n="4a" title="Weld map" />
        <View style={{ flexDirection: "row", flexWrap: "wrap", alignItems: "center", marginBottom: 6 }}>
          <Text style={[s.small, { color: COLOR.body, marginRight: 4 }]}>Where each weld joint is on the part. Marker shape by state:</Text>
          {LEGEND.map((st) => (
            <View key={st} style={{ flexDirection: "row", alignItems: "center", marginRight: 8 }}>
              <MapMark state={st} />
              <Text style={[s.small, { color: COLOR.body, marginLeft: 2 }]}>{st === "repair" ? "sent back for repair" : MARKER_LOOK[st].word}</Text>
            </View>
          ))}
        </View>
        {map.images[0] ? image(map.images[0], 0) : null}
      </View>
      {map.images.slice(1).map((img, n) => image(img, n + 1))}
      <KeptTable
        head={<Text style={[s.subHead, { marginTop: 4 }]}>Weld joints on the map</Text>}
        cols={WELD_MAP_COLS}
        empty="No joints placed."
        rows={[...map.joints]
          .sort((a, b) => a.jointId.localeCompare(b.jointId, "en", { numeric: true }))
          .map((j) => (
            <View key={j.jointId} style={s.tr} wrap={false}>
              <Cell flex={1}>
                <Text style={[s.mono, s.bold]}>{j.jointId}</Text>
              </Cell>
              <Cell flex={1}>
                <Text>{`Image ${map.images.findIndex((i) => i.id === j.imageId) + 1}`}</Text>
              </Cell>
              <Cell flex={2}>
                <Text style={s.mono}>{`${Math.round(j.x * 100)} % across, ${Math.round(j.y * 100)} % down${j.path ? ", seam line" : ""}`}</Text>
              </Cell>
              <Cell flex={2}>
                <View style={{ flexDirection: "row", alignItems: "center" }}>
                  <MapMark state={j.state} />
                  <Text style={{ marginLeft: 3 }}>{MARKER_LOOK[j.state].word}</Text>
                </View>
              </Cell>
            </View>
          ))}
      />
    </View>
  );
}

const WELD_MAP_COLS: Col[] = [
  { title: "Joint", flex: 1 },
  { title: "Image", flex: 1 },
  { title: "Where", flex: 2 },
  { title: "State", flex: 2 },
];

// ───────────────────────────── nonconformances ─────────────────────────────

function NcSection({ c }: { c: Ctx }) {
  const cols: Col[] = [
    { title: "No.", flex: 0.45 },
    { title: "Step", flex: 0.9 },
    { title: "Description", flex: 2.6 },
    { title: "Raised", flex: 1.3 },
    { title: "Disposition", flex: 2.4 },
  ];
  return (
    <KeptTable
      head={<SectionHead n={5} title="Nonconformances and dispositions" />}
      cols={cols}
      empty="No nonconformances were raised on this job."
      rows={c.d.nonconformances.map((n) => (
            <View key={n.number} style={s.tr} wrap={false}>
              <Cell flex={0.45}>
                <Text style={[s.mono, s.bold]}>{`NC-${n.number}`}</Text>
              </Cell>
              <Cell flex={0.9}>
                <Text style={[s.mono, s.small]}>{P(n.stepKey ?? "") || "\u2014"}</Text>
              </Cell>
              <Cell flex={2.6}>
                <Para text={n.description} />
              </Cell>
              <Cell flex={1.3}>
                <Text style={s.small}>{P(n.raisedBy ?? "") || "\u2014"}</Text>
                <Text style={[s.mono, s.tiny, { color: COLOR.body }]}>{n.raisedAt ? when(c, n.raisedAt) : ""}</Text>
              </Cell>
              <Cell flex={2.4}>
                {n.disposition === null ? (
                  <Verdict kind="open" word="open, awaiting disposition" />
                ) : (
                  <View>
                    <Text style={s.bold}>{DISPOSITION_WORD[n.disposition]}</Text>
                    {n.dispositionNotes ? <Para style={s.small} text={n.dispositionNotes} /> : null}
                    <Text style={[s.small, { color: COLOR.body }]}>
                      Dispositioned by {P(n.dispositionedBy ?? "")} {"\u00b7"} <Text style={[s.mono, s.tiny]}>{when(c, n.dispositionedAt)}</Text>
                    </Text>
                  </View>
                )}
              </Cell>
            </View>
          ))}
    />
  );
}

// ───────────────────────────── materials ─────────────────────────────

const MATERIAL_KIND_WORD = { base: "Base metal", filler: "Filler metal", other: "Other" } as const;

// ISO 3834-2 traceability: every material entry by heat or lot number, then the filler lots the passes
// logged, so a reader can match one against the other.
function MaterialsSection({ c }: { c: Ctx }) {
  const { entries, fillers } = c.d.materials;
  const cols: Col[] = [
    { title: "Kind", flex: 0.8 },
    { title: "Description", flex: 2 },
    { title: "Specification", flex: 1.4 },
    { title: "Heat / lot no.", flex: 1.1 },
    { title: "Certificate", flex: 1.1 },
    { title: "Recorded", flex: 1.3 },
  ];
  return (
    <View>
      <KeptTable
        head={<SectionHead n={6} title="Material traceability" />}
        cols={cols}
        empty="No material entries recorded on this job."
        rows={entries.map((m, i) => (
          <View key={i} style={s.tr} wrap={false}>
            <Cell flex={0.8}>
              <Text style={s.small}>{MATERIAL_KIND_WORD[m.kind]}</Text>
            </Cell>
            <Cell flex={2}>
              <Text style={m.withdrawn ? { color: COLOR.muted } : {}}>{P(m.description)}</Text>
              {m.withdrawn ? <Verdict kind="withdrawn" word="withdrawn, no longer used on this job" /> : null}
              {m.reason ? <Para style={[s.tiny, { color: COLOR.body }]} text={`${m.withdrawn ? "Why withdrawn" : m.corrects ? "Corrects an earlier entry" : "Reason"}: ${m.reason}`} /> : null}
            </Cell>
            <Cell flex={1.4}>
              <Text style={s.small}>{P(m.specification) || "\u2014"}</Text>
            </Cell>
            <Cell flex={1.1}>
              <Text style={[s.mono, s.bold]}>{P(m.heatNumber)}</Text>
            </Cell>
            <Cell flex={1.1}>
              <Text style={[s.mono, s.small]}>{P(m.certificate) || "\u2014"}</Text>
            </Cell>
            <Cell flex={1.3}>
              <Text style={s.small}>{P(m.recordedBy) || "\u2014"}</Text>
              {m.recordedAt ? <Text style={[s.mono, s.tiny, { color: COLOR.body }]}>{when(c, m.recordedAt)}</Text> : null}
            </Cell>
          </View>
        ))}
      />
      {fillers.length ? (
        <View wrap={false}>
          <Text style={s.subHead}>Filler lots logged on the weld passes</Text>
          <View style={s.table}>
            <TableHead
              cols={[
                { title: "Classification", flex: 1.5 },
                { title: "\u00d8 mm", flex: 0.45, align: "right" },
                { title: "Lot", flex: 1 },
                { title: "Joints", flex: 1.5 },
              ]}
            />
            {fillers.map((f, i) => (
              <View key={i} style={s.tr} wrap={false}>
                <Cell flex={1.5}>
                  <Text>{P(f.classification) || "\u2014"}</Text>
                </Cell>
                <Cell flex={0.45} align="right">
                  <Text style={s.mono}>{f.diameterMm === undefined ? "\u2014" : formatNumber(f.diameterMm, 1)}</Text>
                </Cell>
                <Cell flex={1}>
                  <Text style={[s.mono, s.bold]}>{P(f.lot)}</Text>
                </Cell>
                <Cell flex={1.5}>
                  <Text style={[s.mono, s.small]}>{P(f.joints.join(", ")) || "\u2014"}</Text>
                </Cell>
              </View>
            ))}
          </View>
        </View>
      ) : null}
    </View>
  );
}

// ───────────────────────────── photos ─────────────────────────────

function PhotoSheet({ c, end }: { c: Ctx; end: ReactNode }) {
  const perRow = 4;
  const gap = 8;
  const w = (c.contentWidth - gap * (perRow - 1)) / perRow;
  const h = w * 0.75;
  const head = <SectionHead n={7} title="Photo contact sheet" />;
  if (c.d.photos.length === 0) {
    return (
      <View wrap={false}>
        {head}
        <None>No photos on this job.</None>
        {end}
      </View>
    );
  }
  const rows: TravellerRecord["photos"][] = [];
  for (let i = 0; i < c.d.photos.length; i += perRow) rows.push(c.d.photos.slice(i, i + perRow));
  const row = (photos: TravellerRecord["photos"], r: number) => (
    <View style={[s.row, { marginBottom: 10 }]}>
      {photos.map((p, j) => {
        const n = r * perRow + j + 1;
        return (
          <View key={n} style={{ width: w, marginRight: j === perRow - 1 ? 0 : gap }}>
            <PdfImage src={{ data: p.image, format: p.image[0] === 0x89 ? "png" : "jpg" }} style={{ width: w, height: h, objectFit: "cover", backgroundColor: COLOR.panel }} />
            <Text style={[s.mono, s.tiny, { marginTop: 2, color: COLOR.muted }]}>
              <Text style={[s.bold, { color: COLOR.ink }]}>{`P${n}  `}</Text>
              {[p.stepKey ? P(p.stepKey) : "", p.sha256 ? `#${p.sha256.slice(0, 8)}` : ""].filter(Boolean).join(" \u00b7 ")}
            </Text>
            <Text style={[s.tiny, { color: COLOR.ink2 }]}>{P(p.caption) || "\u2014"}</Text>
            {p.takenAt ? <Text style={[s.mono, s.tiny, { color: COLOR.muted }]}>{when(c, p.takenAt)}</Text> : null}
          </View>
        );
      })}
    </View>
  );
  // Heading with the first row, the end mark with the last, so neither sits alone on a page.
  return (
    <View>
      {rows.map((photos, r) => {
        const first = r === 0;
        const last = r === rows.length - 1;
        return (
          <View key={r} wrap={false}>
            {first ? head : null}
            {row(photos, r)}
            {last ? end : null}
          </View>
        );
      })}
    </View>
  );
}

function EndMark({ c }: { c: Ctx }) {
  return (
    <View wrap={false} style={{ marginTop: 14, borderTopWidth: 1, borderTopColor: COLOR.ink, paddingTop: 5 }}>
      <View style={[s.row, { justifyContent: "space-between" }]}>
        <Text style={[s.small, s.bold]}>End of traveller {P(c.d.jobNumber)}</Text>
        <Text style={[s.small, { color: COLOR.body }]}>
          Seal <Text style={s.mono}>{sealShort(c.d.seal.sha256)}</Text> over {c.d.seal.entries} record entries
        </Text>
      </View>
      <Text style={[s.tiny, { color: COLOR.body, marginTop: 3 }]}>
        {HAZARD_LINE} {SAFETY_NOTE}
      </Text>
    </View>
  );
}

// ───────────────────────────── document ─────────────────────────────

function buildCtx(d: TravellerRecord): Ctx {
  const refs = new Map<string, string>();
  const amendedBy = new Map<string, string[]>();
  let n = 0;
  for (const sec of d.sections) for (const st of sec.steps) for (const so of st.signOffs) refs.set(so.id, `S${++n}`);
  for (const sec of d.sections)
    for (const st of sec.steps)
      for (const so of st.signOffs) {
        if (!so.amends) continue;
        const list = amendedBy.get(so.amends.signOffId) ?? [];
        list.push(refs.get(so.id) ?? "?");
        amendedBy.set(so.amends.signOffId, list);
      }
  const [width] = PAGE_SIZE_PT[d.paper];
  return { d, tz: d.timeZone, refs, amendedBy, contentWidth: width - 2 * MARGIN.side, qr: makeQr(d.verifyUrl, "M") };
}

export type TravellerConformance = "PDF/A-1b" | "PDF/A-2b" | "PDF/A-3b";

export type RenderOptions = {
  /** PDF/A level for long-term archiving; fonts are embedded either way */
  conformance?: TravellerConformance | null;
  /** folder holding the .woff files; defaults to process.cwd()/public/fonts */
  fontDir?: string;
};

export function TravellerDocument({ data, conformance }: { data: TravellerRecord; conformance?: TravellerConformance | null }) {
  const c = buildCtx(data);
  const wip = !data.released;
  // Header, work-in-progress banner and footer are page chrome: react-pdf reserves their space on
  // every page and flows the content through the region in the middle.
  const chrome: NonNullable<PageProps["layout"]> = ({ children, pageNumber, totalPages }) => (
    <>
      <Header c={c} pageNumber={pageNumber} totalPages={totalPages} />
      {wip ? <WipBanner c={c} /> : null}
      <View style={{ flexGrow: 1 }}>{children}</View>
      <Footer c={c} />
    </>
  );
  const size = data.paper === "a4" ? "A4" : "LETTER";
  return (
    <Document
      title={`Traveller ${data.jobNumber}${wip ? " (work in progress)" : ""}`}
      author={data.shopName}
      subject={`Axle job traveller, seal ${sealShort(data.seal.sha256)}`}
      creator="Gusset"
      producer="Gusset"
      language="en"
      creationDate={data.printedAt}
      conformance={conformance ?? undefined}
    >
      {/* The record sheet stands alone; everything after it flows. A `layout` template opts into
          react-pdf 4.9's newer pagination engine, which measures content once and packs it into pages:
          a 40-step traveller lays out in well under half the time of the default engine, which lays
          out everything left again at each page break (and again for a page-x-of-y text). */}
      {[
        <RecordPage key="record" c={c} />,
        <View key="body">
          <Checklist c={c} />
          <GeometrySection c={c} />
          <WeldSection c={c} />
          <WeldMapSection c={c} />
          <NcSection c={c} />
          <MaterialsSection c={c} />
          <PhotoSheet c={c} end={<EndMark c={c} />} />
        </View>,
      ].map((part) => (
        <Page key={part.key} size={size} style={s.page} layout={chrome}>
          {part}
        </Page>
      ))}
    </Document>
  );
}

/** Default PDF/A level: archival, and it costs little with fonts already embedded. */
export const DEFAULT_CONFORMANCE: TravellerConformance = "PDF/A-2b";

/** Validate the data and render the traveller. Throws a ZodError when the data is not a valid traveller. */
export async function renderTraveller(data: TravellerData, options: RenderOptions = {}): Promise<Buffer> {
  const record = parseTravellerData(data);
  registerTravellerFonts(options.fontDir);
  const doc = <TravellerDocument data={{ ...record, printedAt: record.printedAt ?? new Date() }} conformance={options.conformance === undefined ? DEFAULT_CONFORMANCE : options.conformance} />;
  return renderToBuffer(doc);
}

export { parseTravellerData, type TravellerData, type TravellerRecord };
