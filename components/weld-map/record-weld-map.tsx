// A job's weld map from its record: every joint with its state (welding, waiting for inspection, sent back,
// accepted), the given joint highlighted. Nothing when the job has no map.
import type { JobRecord } from "@/lib/jobs/record";
import { jointStates, WeldMapView } from "./weld-map-view";

export function RecordWeldMap({ record, highlight, testId = "job-weld-map", title = "Weld map" }: { record: Pick<JobRecord, "weldMap" | "steps">; highlight?: string; testId?: string; title?: string }) {
  const map = record.weldMap;
  if (!map) return null;
  return (
    <section aria-label={title} className="rounded-lg border-2 border-graphite-300 bg-white p-3">
      <h3 className="mb-2 font-bold">
        {title}
        {map.rebasedAt ? <span className="ml-2 text-sm font-normal text-graphite-700">on a photo of this axle</span> : null}
      </h3>
      <WeldMapView
        images={map.images.map((i, n) => ({ id: i.id, url: i.url, width: i.width, height: i.height, label: i.photoId ? "Photo of this axle" : `Drawing ${n + 1}` }))}
        joints={map.joints}
        states={jointStates(record.steps)}
        highlight={highlight}
        testId={testId}
        maxHeight="45vh"
      />
    </section>
  );
}
