// The traveller PDF: feed it a TravellerData object, get PDF bytes. Server-only (reads fonts from disk).
export { renderTraveller } from "./traveller";
