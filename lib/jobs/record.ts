// The shape of a job's whole record as GET /api/jobs/{id} answers it (and the job page renders it).
// Dates are ISO strings so the same type serves the server, the JSON and the browser.
import type { Step, StepKind } from "@/lib/procedures/schema";
import type { VisualCriteria, VisualItemResult, VisualObservations, WpsFinding, WpsRanges } from "@/lib/welding";
import type { DispositionName, JobStateName, JointState } from "./labels";
import type { JointFacts, Readiness } from "./readiness";

export type PersonRef = { id: string; name: string };

export type SignOffView = {
  id: string;
  stepId: string | null;
  nonconformanceId: string | null;
  userId: string;
  printedName: string;
  role: string;
  meaning: "performed" | "inspected" | "dispositioned" | "released";
  signedAt: string;
  contentHash: string;
  amendsSignOffId: string | null;
  reason: string | null;
  /** the value that was signed (step sign-offs) */
  value: Record<string, unknown> | null;
  /** weld joints: the round this sign-off belongs to */
  round: number | null;
};

export type PhotoView = {
  id: string;
  stepId: string | null;
  nonconformanceId: string | null;
  url: string;
  thumbUrl: string;
  sha256: string;
  width: number;
  height: number;
  size: number;
  caption: string;
  uploadedAt: string;
  uploadedBy: PersonRef;
  removed: boolean;
};

export type PassView = {
  id: string;
  stepId: string;
  passNumber: number;
  welder: PersonRef;
  process: string;
  volts: number;
  amps: number;
  travelSpeedMmPerMin: number;
  travelSpeedUnit: "mm/min" | "in/min";
  preheatC: number;
  interpassC: number | null;
  fillerLot: string;
  arcEnergyKJPerMm: number;
  heatInputKJPerMm: number;
  recordedAt: string;
  removed: boolean;
  /** the joint's round: 1, then one per repair after a rejection */
  round: number;
  position: string;
  fillerClassification: string;
  wps: { revisionId: string | null; reference: string; number: number | null };
  heatInputMethod: "voltage-current" | "energy" | "power";
  beadLengthMm: number | null;
  arcTimeS: number | null;
  machineEnergyKJ: number | null;
  machinePowerW: number | null;
  jPerIn: number | null;
  /** the pass against its WPS revision's ranges (lib/welding checkPassAgainstWps) */
  findings: WpsFinding[];
  outOfRange: boolean;
  /** a lead's acceptance of an out-of-range pass */
  override: { reason: string; by: PersonRef; at: string } | null;
};

export type InspectionView = {
  id: string;
  stepId: string;
  round: number;
  criteria: VisualCriteria;
  observations: VisualObservations;
  items: VisualItemResult[];
  judged: "accept" | "reject";
  decision: "accepted" | "rejected";
  notes: string;
  photoIds: string[];
  inspector: PersonRef;
  signOffId: string;
  inspectedAt: string;
  /** after a rejection: how the defect was taken out before the repair round (round + 1) is welded */
  repair?: RepairView | null;
};

export type RepairView = {
  id: string;
  round: number;
  method: "grinding" | "air-arc-gouging" | "machining" | "other";
  methodNote: string;
  depthMm: number;
  lengthMm: number;
  photoId: string;
  recordedBy: PersonRef;
  recordedAt: string;
};

export type { JointState };

export type JointRound = {
  round: number;
  passes: PassView[];
  /** the welder's sign-off that the round's passes are done */
  performed: SignOffView | null;
  inspection: InspectionView | null;
};

export type JointView = {
  jointId: string;
  state: JointState;
  /** the round being welded or waiting for inspection; the last round once accepted */
  round: number;
  rounds: JointRound[];
  /** everyone who recorded a pass of this joint, in any round, struck out or not */
  welderIds: string[];
  uncovered: JointFacts["uncovered"];
};

export type MaterialView = {
  id: string;
  kind: "base" | "filler" | "other";
  description: string;
  specification: string;
  heatNumber: string;
  certificate: string;
  correctsId: string | null;
  withdrawn: boolean;
  reason: string | null;
  recordedBy: PersonRef;
  recordedAt: string;
  /** replaced by a later correction: shown struck through */
  superseded: boolean;
};

/** A published WPS revision a weld step of the job names, with the ranges its passes are checked against. */
export type WpsSummary = {
  reference: string;
  revisionId: string;
  number: number;
  title: string;
  process: string | null;
  positions: string[];
  ranges: WpsRanges;
};

export type QualificationSummary = { process: string; ok: boolean; reason: string; lapsedOn: string | null; expiresOn: string | null };

export type DispositionView = {
  disposition: DispositionName;
  notes: string;
  decidedBy: PersonRef;
  decidedAt: string;
  signOffId: string;
  /** SHA-256 of the disposition's signed content */
  contentHash: string;
};

export type NonconformanceView = {
  id: string;
  number: number;
  stepId: string;
  stepKey: string;
  stepTitle: string;
  description: string;
  proposedDisposition: DispositionName;
  observed: Record<string, unknown> | null;
  raisedBy: PersonRef;
  raisedAt: string;
  photoIds: string[];
  disposition: DispositionView | null;
};

export type StepView = {
  id: string;
  position: number;
  sectionKey: string;
  sectionTitle: string;
  sectionPosition: number;
  key: string;
  kind: StepKind;
  title: string;
  spec: Step;
  /** working value (before signing) */
  value: Record<string, unknown> | null;
  version: number;
  updatedAt: string | null;
  updatedBy: PersonRef | null;
  signed: boolean;
  signedAt: string | null;
  /** the hold point keeping this step locked */
  lockedBy: { id: string; title: string } | null;
  /** what the record says now: the latest sign-off's value, else the working value */
  effectiveValue: Record<string, unknown> | null;
  signOffs: SignOffView[];
  photoIds: string[];
  readiness: Readiness;
  /** why the person asking may not sign this step (role, separation of duties), or null */
  signBlock: string | null;
  meaning: "performed" | "inspected";
  /** weld steps: the joint's rounds and where it stands */
  joint: JointView | null;
  /** weld steps: why the person asking may not inspect this joint now, or null when they may */
  inspectBlock: string | null;
};

export type JobHeader = {
  id: string;
  number: string;
  status: JobStateName;
  customerName: string;
  customerPhone: string;
  customerEmail: string;
  vehicleYear: number | null;
  vehicleMakeModel: string;
  vin: string;
  vinWarning: string | null;
  axleDescription: string;
  axleTag: string;
  procedureId: string;
  procedureVersionId: string;
  procedureVersionNumber: number;
  procedureTitle: string;
  dueDate: string | null;
  notes: string;
  stepsTotal: number;
  stepsSigned: number;
  openNonconformances: number;
  version: number;
  welders: PersonRef[];
  inspector: PersonRef | null;
  createdBy: PersonRef;
  createdAt: string;
  updatedAt: string;
  startedAt: string | null;
  releasedAt: string | null;
  releasedBy: PersonRef | null;
  voidedAt: string | null;
  voidReason: string | null;
};

/** An image of the job's weld map: the procedure's (procedureImageId) or a photo of this axle (photoId). */
export type WeldMapImageView = { id: string; photoId?: string; procedureImageId?: string; width: number; height: number; sha256: string; url: string };
export type WeldMapView = {
  images: WeldMapImageView[];
  joints: { jointId: string; imageId: string; x: number; y: number; path?: { x: number; y: number }[] }[];
  /** set once the map was moved onto a photo of this axle */
  rebasedAt: string | null;
};

export type JobRecord = {
  job: JobHeader;
  /** where each weld joint is; null when the procedure version has no map */
  weldMap: WeldMapView | null;
  steps: StepView[];
  photos: PhotoView[];
  passes: PassView[];
  nonconformances: NonconformanceView[];
  inspections: InspectionView[];
  materials: MaterialView[];
  /** published WPS revisions named by the job's weld steps; a reference missing here is not in the library */
  wps: WpsSummary[];
  /** the viewer's continuity for each process the job's weld steps use (welders only) */
  qualifications: QualificationSummary[];
  releaseSignOff: SignOffView | null;
  releaseBlockers: string[];
  viewer: { userId: string; name: string; roles: string[]; unitSystem: "metric" | "imperial" };
};

export type JobListRow = {
  id: string;
  number: string;
  status: JobStateName;
  customerName: string;
  vehicle: string;
  vin: string;
  vinWarning: boolean;
  axleTag: string;
  procedure: string;
  dueDate: string | null;
  stepsTotal: number;
  stepsSigned: number;
  openNonconformances: number;
  welders: string[];
  updatedAt: string;
};
