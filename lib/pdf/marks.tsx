// Verdict shapes drawn as vectors: the embedded latin subsets have no ●, ✕ or ▲, and a state must read
// by shape and word even on a black-and-white copy. Every mark is paired with its word by the caller.
import { Path, Svg, Text, View } from "@react-pdf/renderer";
import { COLOR, MIN_TEXT_PT } from "./theme";

export type MarkShape = "dot" | "cross" | "ring" | "triangle" | "dash" | "square";

export function Mark({ shape, color = COLOR.ink, size = 7 }: { shape: MarkShape; color?: string; size?: number }) {
  // Plain boxes where a box will do: each Svg costs react-pdf several layout nodes, and a 40-step
  // traveller carries a hundred or more marks.
  const d = size * 0.84;
  const box = { width: size, height: size, alignItems: "center", justifyContent: "center" } as const;
  switch (shape) {
    case "dot":
      return (
        <View style={box}>
          <View style={{ width: d, height: d, borderRadius: d / 2, backgroundColor: color }} />
        </View>
      );
    case "ring":
      return (
        <View style={box}>
          <View style={{ width: d * 0.9, height: d * 0.9, borderRadius: d / 2, borderWidth: size * 0.14, borderColor: color }} />
        </View>
      );
    case "square":
      return (
        <View style={box}>
          <View style={{ width: d * 0.85, height: d * 0.85, backgroundColor: color }} />
        </View>
      );
    case "dash":
      return (
        <View style={box}>
          <View style={{ width: d, height: size * 0.2, backgroundColor: color }} />
        </View>
      );
    case "cross":
      return (
        <Svg width={size} height={size} viewBox="0 0 10 10">
          <Path d="M1.6 1.6 L8.4 8.4 M8.4 1.6 L1.6 8.4" stroke={color} strokeWidth={2.1} strokeLinecap="round" />
        </Svg>
      );
    case "triangle":
      return (
        <Svg width={size} height={size} viewBox="0 0 10 10">
          <Path d="M5 0.8 L9.6 9.2 L0.4 9.2 Z" fill={color} />
        </Svg>
      );
  }
}

export type VerdictKind = "pass" | "fail" | "na" | "within" | "over" | "accept" | "reject" | "open" | "signed" | "warn" | "waiting" | "withdrawn";

const VERDICTS: Record<VerdictKind, { shape: MarkShape; color: string; word: string }> = {
  pass: { shape: "dot", color: COLOR.pass, word: "pass" },
  fail: { shape: "cross", color: COLOR.fail, word: "fail" },
  na: { shape: "dash", color: COLOR.muted, word: "n/a" },
  within: { shape: "dot", color: COLOR.pass, word: "within WPS" },
  over: { shape: "cross", color: COLOR.fail, word: "over WPS" },
  accept: { shape: "dot", color: COLOR.pass, word: "accept" },
  reject: { shape: "cross", color: COLOR.fail, word: "reject" },
  open: { shape: "ring", color: COLOR.muted, word: "open" },
  signed: { shape: "dot", color: COLOR.ink, word: "signed" },
  warn: { shape: "triangle", color: COLOR.warn, word: "check" },
  waiting: { shape: "square", color: COLOR.ink2, word: "waiting" },
  withdrawn: { shape: "cross", color: COLOR.muted, word: "withdrawn" },
};

/** A shape and its word, e.g. a filled dot and "pass". */
export function Verdict({ kind, word, size = 7, fontSize = MIN_TEXT_PT, width }: { kind: VerdictKind; word?: string; size?: number; fontSize?: number; width?: number }) {
  const v = VERDICTS[kind];
  return (
    <View style={{ flexDirection: "row", alignItems: "center", marginTop: 0.5, ...(width === undefined ? {} : { width, marginLeft: 6 }) }}>
      <Mark shape={v.shape} color={v.color} size={size} />
      <Text style={{ marginLeft: 3, fontSize, fontWeight: 600, color: v.color }}>{word ?? v.word}</Text>
    </View>
  );
}
