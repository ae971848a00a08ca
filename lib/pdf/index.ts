// The traveller PDF: feed it a TravellerData object, get PDF bytes. Server-only (reads fonts from disk).
export { renderTraveller, TravellerDocument, DEFAULT_CONFORMANCE, PAGE_SIZE_PT, WIP_TITLE, VOID_TITLE, HAZARD_LINE } from "./traveller";
export type { RenderOptions, TravellerConformance } from "./traveller";
export { travellerDataSchema, parseTravellerData } from "./traveller-data";
export type { TravellerData, TravellerRecord, TravellerJobState, TravellerStepKind, SignOffMeaning, TravellerDisposition, PaperSize } from "./traveller-data";
export { makeQr, type TravellerQr } from "./qr";
