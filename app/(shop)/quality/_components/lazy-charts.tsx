"use client";
// The charting library is loaded only when the Quality screen is open, never in the app's first load.
import dynamic from "next/dynamic";

const loading = () => <div className="h-40 animate-pulse rounded-md bg-graphite-50" aria-hidden="true" />;

export const YieldChart = dynamic(() => import("./quality-charts").then((m) => m.YieldChart), { ssr: false, loading });
export const DefectsChart = dynamic(() => import("./quality-charts").then((m) => m.DefectsChart), { ssr: false, loading });
export const HeatChart = dynamic(() => import("./quality-charts").then((m) => m.HeatChart), { ssr: false, loading });
