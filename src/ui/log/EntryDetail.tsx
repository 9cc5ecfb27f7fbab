/** One logged entry opened: its figures, Reopen, Share, Delete; stored vs recomputed figures. */
import { MODEL_VERSION } from "../../core/caution.ts";
import { estimateLocal } from "../../core/estimate.ts";
import type { BandOutput, EstimateOutput } from "../../core/types.ts";
import type { LogEntry } from "../../storage/schema.ts";
import { distanceText, placeText, timeText } from "./summary.ts";

function recompute(e: LogEntry): { out: EstimateOutput | null; problem: string | null } {
  try {
    return { out: estimateLocal(e.scenario), problem: null };
  } catch (err) {
    return { out: null, problem: err instanceof Error ? err.message : String(err) };
  }
}

function widthText(b: BandOutput | undefined): string {
  return b ? distanceText(b.max_width_m) : "–";
}

export function EntryDetail(p: {
  entry: LogEntry;
  onReopen: () => void;
  onShare: (entry: LogEntry, recomputed: EstimateOutput) => void;
  onCopy: (entry: LogEntry, recomputed: EstimateOutput) => void;
  onPrint: (entry: LogEntry, recomputed: EstimateOutput) => void;
  onDelete: () => void;
  onClose: () => void;
}) {
  const e = p.entry;
  const differs = e.model_version !== MODEL_VERSION;
  const { out, problem } = recompute(e);
  const canShare = out !== null && e.scenario.source !== undefined;
  return (
    <section class="dm-log-detail" aria-labelledby="dm-log-detail-title" data-testid="log-detail">
      <h4 id="dm-log-detail-title">Entry of {timeText(e.time_local)}</h4>
      <p>
        Place: {placeText(e.place)}. Model: {e.model_version}. Stability class{" "}
        {e.results.stability_used}.
      </p>
      {e.note ? <p class="dm-log-note">Note: {e.note}</p> : null}
      {e.scenario.limit_set ? (
        <p data-testid="log-limit-set">
          Limit set: {e.scenario.limit_set.name}. Source:{" "}
          {e.scenario.limit_set.source_note || "none given"}.
        </p>
      ) : null}
      {differs ? (
        <p class="dm-log-version" role="note">
          Logged with {e.model_version}; this app runs {MODEL_VERSION}. Stored figures are shown
          beside the figures the current model gives for the same inputs.
        </p>
      ) : null}
      <table class="dm-log-figures">
        <caption>Figures as logged{differs ? " and recomputed" : ""}</caption>
        <thead>
          <tr>
            <th scope="col">Limit</th>
            <th scope="col">Reach{differs ? " (logged)" : ""}</th>
            {differs ? <th scope="col">Reach (now)</th> : null}
            <th scope="col">Width{differs ? " (logged)" : ""}</th>
            {differs ? <th scope="col">Width (now)</th> : null}
          </tr>
        </thead>
        <tbody>
          {e.results.bands.map((b, i) => {
            const now = out?.bands[i];
            return (
              <tr key={`${b.label}-${i}`}>
                <th scope="row">{b.label}</th>
                <td>{distanceText(b.reach_m)}</td>
                {differs ? <td>{now ? distanceText(now.reach_m) : "–"}</td> : null}
                <td>{widthText(b)}</td>
                {differs ? <td>{widthText(now)}</td> : null}
              </tr>
            );
          })}
        </tbody>
      </table>
      {e.results.warnings.length > 0 ? (
        <ul class="dm-log-warnings" aria-label="Model limits when logged">
          {e.results.warnings.map((w) => (
            <li key={`${w.code}-${w.limit ?? ""}`}>{w.message}</li>
          ))}
        </ul>
      ) : null}
      {problem ? <p role="alert">These inputs cannot be recomputed now: {problem}</p> : null}
      <div class="dm-log-actions">
        <button type="button" onClick={p.onReopen}>
          Reopen as new estimate
        </button>
        <button
          type="button"
          class="secondary"
          disabled={!canShare}
          onClick={() => out && p.onShare(e, out)}
        >
          Share footprint
        </button>
        <button
          type="button"
          class="secondary"
          disabled={!canShare}
          onClick={() => out && p.onCopy(e, out)}
        >
          Copy GeoJSON
        </button>
        <button
          type="button"
          class="secondary"
          disabled={out === null}
          onClick={() => out && p.onPrint(e, out)}
        >
          Print this estimate
        </button>
        <button type="button" class="secondary" onClick={p.onDelete}>
          Delete entry
        </button>
        <button type="button" class="secondary" onClick={p.onClose}>
          Close entry
        </button>
      </div>
      {!canShare && out ? (
        <p class="hint">No source position: the footprint cannot be placed.</p>
      ) : null}
      {canShare && differs ? (
        <p class="hint">A shared footprint is drawn with the current model ({MODEL_VERSION}).</p>
      ) : null}
    </section>
  );
}
