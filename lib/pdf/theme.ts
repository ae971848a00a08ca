// Gusset's print identity: graphite neutrals, the primer yellow-green accent used sparingly (a printer
// may have no colour), verdicts by word and shape. Same values as tailwind.config.ts.
import { StyleSheet } from "@react-pdf/renderer";
import { FIGURE_FONT, TEXT_FONT } from "./fonts";

export const COLOR = {
  ink: "#171b1a",
  ink2: "#303634",
  body: "#424946",
  muted: "#58605d",
  faint: "#7b8380",
  ruleStrong: "#cdd1cf",
  rule: "#e7e9e8",
  panel: "#f4f5f4",
  primer: "#aec22b",
  primerDeep: "#5f6c12",
  primerWash: "#f1f6cf",
  pass: "#2f4a08",
  fail: "#a3241b",
  warn: "#7a5200",
  white: "#ffffff",
} as const;

// OpenType features. Inter's contextual alternates turn "4x4" into "4×4" and "->" into an arrow, and a
// record prints the characters it was given; the mark, composition and required-ligature features do
// nothing for the precomposed latin text `printable` lets through, but fontkit still runs them on every
// glyph. Kerning stays on for the text face; the figure face is monospaced and needs none.
const OFF = { calt: false, ccmp: false, locl: false, mark: false, mkmk: false, rlig: false, rclt: false, clig: false, curs: false } as const;
export const TEXT_FEATURES = { ...OFF };
// The smallest text on the traveller: 8 pt stays legible on a photocopy and under a shop light.
export const MIN_TEXT_PT = 8;

export const FIGURE_FEATURES = { ...OFF, kern: false, liga: false };

export const MARGIN = { side: 40, top: 22, bottom: 18 } as const;

export const s = StyleSheet.create({
  page: {
    fontFamily: TEXT_FONT,
    fontSize: 8.5,
    // No lineHeight here: react-pdf 4.9 resolves a unitless lineHeight to points before children inherit
    // it, so every larger text would overlap the line below (and its old pagination engine resolves it a
    // second time as a multiplier, pushing page-number texts out of their box). The faces' own line gaps
    // are used instead.
    color: COLOR.ink,
    fontFeatureSettings: TEXT_FEATURES,
    paddingLeft: MARGIN.side,
    paddingRight: MARGIN.side,
    paddingTop: MARGIN.top,
    paddingBottom: MARGIN.bottom,
  },
  mono: { fontFamily: FIGURE_FONT, fontFeatureSettings: FIGURE_FEATURES },
  label: { fontSize: MIN_TEXT_PT, fontWeight: 600, color: COLOR.muted, letterSpacing: 0.6, textTransform: "uppercase" },
  muted: { color: COLOR.muted },
  small: { fontSize: MIN_TEXT_PT },
  tiny: { fontSize: MIN_TEXT_PT },
  bold: { fontWeight: 600 },
  row: { flexDirection: "row" },

  header: { marginBottom: 14 },
  headerRow: { flexDirection: "row", alignItems: "flex-end", justifyContent: "space-between" },
  headerShop: { fontSize: 9.5, fontWeight: 700 },
  headerField: { marginLeft: 16, alignItems: "flex-end" },
  headerValue: { fontFamily: FIGURE_FONT, fontFeatureSettings: FIGURE_FEATURES, fontSize: 9, fontWeight: 500 },
  headerRule: { flexDirection: "row", marginTop: 5, height: 1.5 },

  wip: { flexDirection: "row", alignItems: "stretch", borderWidth: 1.25, borderColor: COLOR.ink, marginTop: -6, marginBottom: 12 },
  wipBlock: { backgroundColor: COLOR.ink, paddingHorizontal: 8, justifyContent: "center" },
  wipText: { fontSize: 8, fontWeight: 700, letterSpacing: 0.6, color: COLOR.white },
  wipSubBox: { flexGrow: 1, flexShrink: 1, flexBasis: 0, paddingHorizontal: 8, paddingVertical: 3.5, justifyContent: "center" },
  wipSub: { fontSize: MIN_TEXT_PT, color: COLOR.ink2 },

  footer: {
    flexDirection: "row",
    justifyContent: "space-between",
    borderTopWidth: 0.75,
    borderTopColor: COLOR.ruleStrong,
    paddingTop: 4,
    marginTop: 10,
    fontSize: MIN_TEXT_PT,
    color: COLOR.muted,
  },

  jobNumber: { fontFamily: FIGURE_FONT, fontFeatureSettings: FIGURE_FEATURES, fontSize: 15, fontWeight: 600 },
  sectionHead: { flexDirection: "row", alignItems: "center", marginTop: 16, marginBottom: 6, paddingBottom: 3, borderBottomWidth: 1, borderBottomColor: COLOR.ink },
  sectionNo: { fontFamily: FIGURE_FONT, fontFeatureSettings: FIGURE_FEATURES, fontSize: 8, fontWeight: 600, color: COLOR.muted, marginRight: 6 },
  sectionTitle: { fontSize: 11, fontWeight: 700 },
  accentTick: { width: 3, height: 11, backgroundColor: COLOR.primer, marginRight: 6 },
  subHead: { fontSize: 9, fontWeight: 700, marginTop: 8, marginBottom: 4 },

  kvRow: { flexDirection: "row", paddingVertical: 2.5, borderBottomWidth: 0.5, borderBottomColor: COLOR.rule },
  kvLabel: { width: 74, paddingTop: 1.5 },
  kvValue: { flex: 1, fontSize: 8.5 },

  badge: { flexDirection: "row", alignItems: "center", alignSelf: "flex-start", borderWidth: 1, borderColor: COLOR.ink, paddingHorizontal: 6, paddingVertical: 2, marginTop: 6 },
  badgeText: { fontSize: 8, fontWeight: 700, marginLeft: 4 },

  sealPanel: { width: 176, marginLeft: 18, borderWidth: 0.75, borderColor: COLOR.ruleStrong, padding: 10, alignItems: "center" },
  sealShort: { fontFamily: FIGURE_FONT, fontFeatureSettings: FIGURE_FEATURES, fontSize: 14, fontWeight: 600, letterSpacing: 0.5 },
  sealFull: { fontFamily: FIGURE_FONT, fontFeatureSettings: FIGURE_FEATURES, fontSize: MIN_TEXT_PT, color: COLOR.body, textAlign: "center" },

  stats: { flexDirection: "row", marginTop: 14 },
  stat: { flex: 1, borderTopWidth: 2, borderTopColor: COLOR.ink, paddingTop: 4, marginRight: 10 },
  statValue: { fontFamily: FIGURE_FONT, fontFeatureSettings: FIGURE_FEATURES, fontSize: 13, fontWeight: 600 },

  checklistSection: { marginTop: 10, marginBottom: 1, fontSize: 9.5, fontWeight: 700 },
  step: { paddingVertical: 4.5, borderBottomWidth: 0.5, borderBottomColor: COLOR.ruleStrong },
  stepHead: { flexDirection: "row", alignItems: "flex-start" },
  stepNo: { width: 30, fontFamily: FIGURE_FONT, fontFeatureSettings: FIGURE_FEATURES, fontSize: 8, fontWeight: 600, paddingTop: 0.5 },
  stepTitle: { flex: 1, fontSize: 9, fontWeight: 600 },
  stepKey: { fontFamily: FIGURE_FONT, fontFeatureSettings: FIGURE_FEATURES, fontSize: MIN_TEXT_PT, fontWeight: 400, color: COLOR.faint },
  stepKind: { fontSize: MIN_TEXT_PT, fontWeight: 600, color: COLOR.muted, letterSpacing: 0.6, textTransform: "uppercase", marginLeft: 8, marginTop: 2 },
  stepBody: { paddingLeft: 30 },
  result: { marginTop: 2, color: COLOR.ink2 },
  measures: { marginTop: 3, marginBottom: 1, borderLeftWidth: 1.5, borderLeftColor: COLOR.ruleStrong, paddingLeft: 6 },
  measureRow: { flexDirection: "row", paddingVertical: 0.8, alignItems: "center" },
  signOff: { marginTop: 2.5 },
  signRef: { fontFamily: FIGURE_FONT, fontFeatureSettings: FIGURE_FEATURES, fontSize: MIN_TEXT_PT, color: COLOR.muted },

  table: { borderTopWidth: 1, borderTopColor: COLOR.ink },
  th: { flexDirection: "row", borderBottomWidth: 0.75, borderBottomColor: COLOR.ink, paddingVertical: 3 },
  tr: { flexDirection: "row", borderBottomWidth: 0.5, borderBottomColor: COLOR.ruleStrong, paddingVertical: 3.5 },
  cell: { paddingRight: 5 },
  round: { marginTop: 3, marginLeft: 12, paddingLeft: 6, borderLeftWidth: 1.5, borderLeftColor: COLOR.ruleStrong },
  roundHead: { fontSize: MIN_TEXT_PT, fontWeight: 700, marginBottom: 0.5 },


  safety: { flexDirection: "row", borderWidth: 1.25, borderColor: COLOR.ink, padding: 10, marginTop: 16 },
});
