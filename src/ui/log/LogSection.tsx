/**
 * The log section: "Log this estimate", Share, the log view (newest first, filter, windowed list),
 * one entry opened (Reopen, compare, share, delete with undo), export/import, delete all with a
 * typed confirmation, and the storage status. Contract (used by App.tsx): LogSection({ scenario,
 * result, onReopen }).
 */
import { useMemo, useRef, useState } from "preact/hooks";
import { CAUTION } from "../../core/caution.ts";
import type { EstimateOutput, Scenario } from "../../core/types.ts";
import {
  backupFile,
  footprintFile,
  GEOJSON_MIME,
  logGeoJSON,
  logGeoJSONFileName,
} from "../../export/files.ts";
import { copyText, downloadFile, readFileText, shareFile } from "../../export/share.ts";
import { type ImportSummary, MAX_BACKUP_BYTES } from "../../storage/backup.ts";
import { ImportFileError, StorageQuotaError } from "../../storage/errors.ts";
import { newEntry } from "../../storage/log.ts";
import { formatBytes } from "../../storage/persist.ts";
import type { LogEntry } from "../../storage/schema.ts";
import { sheetOfEntry } from "../sheet/entry.ts";
import type { UnitSystem } from "../units.ts";
import { EntryDetail } from "./EntryDetail.tsx";
import { type LogSummary, matches, timeText } from "./summary.ts";
import { useLog } from "./useLog.ts";
import { WindowedList } from "./WindowedList.tsx";
import "./log.css";

export interface LogSectionProps {
  /** The scenario on screen and its latest valid result (null while inputs are invalid). */
  scenario: Scenario | null;
  result: EstimateOutput | null;
  /** Load a logged entry's inputs into the screen as a new estimate. */
  onReopen: (scenario: Scenario) => void;
  /** The last position the device gave, with its accuracy (m); null when none. */
  positionFix?: { lat: number; lon: number; accuracyM: number } | null;
  /** Display units of the estimate sheet. */
  units?: UnitSystem;
}

/** The word to type before the whole log is deleted. */
export const CONFIRM_WORD = "DELETE";
const ROW_HEIGHT = 104;
const MAX_REJECTIONS_SHOWN = 50;

function message(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}

/** Opens the estimate sheet of an entry in the print dialog (the sheet's code loads on demand). */
function printEntry(entry: LogEntry, output: EstimateOutput, units: UnitSystem): Promise<void> {
  return import("../sheet/print.tsx").then((m) => m.printSheet(sheetOfEntry(entry, output, units)));
}

export function LogSection({
  scenario,
  result,
  onReopen,
  positionFix = null,
  units = "metric",
}: LogSectionProps) {
  const log = useLog();
  const [note, setNote] = useState("");
  const [notice, setNotice] = useState<{ text: string; alert?: boolean } | null>(null);
  const [pending, setPending] = useState<LogEntry | null>(null);
  const [undo, setUndo] = useState<LogEntry | null>(null);
  const [text, setText] = useState("");
  const [day, setDay] = useState("");
  const [selected, setSelected] = useState<LogEntry | null>(null);
  const [confirming, setConfirming] = useState(false);
  const [confirmText, setConfirmText] = useState("");
  const [summary, setSummary] = useState<ImportSummary | null>(null);
  const [onlyShown, setOnlyShown] = useState(false);
  const lastLogged = useRef<{ result: EstimateOutput; entry: LogEntry } | null>(null);
  const askedPersistence = useRef(false);

  const filtered = useMemo(
    () => log.summaries.filter((s) => matches(s, text, day)),
    [log.summaries, text, day],
  );
  const filtering = text.trim() !== "" || day !== "";
  const canShareCurrent = scenario?.source !== undefined && result !== null && scenario !== null;

  /** Writes an entry; on a full device keeps it on screen (pending) and says so. */
  async function write(entry: LogEntry): Promise<boolean> {
    if (!log.store) {
      setPending(entry);
      setNotice({ text: `Not saved: ${log.problem ?? "the log is not open yet"}.`, alert: true });
      return false;
    }
    try {
      await log.store.add(entry);
      log.added(entry);
      setPending(null);
      if (!askedPersistence.current) {
        askedPersistence.current = true;
        await log.askPersistence();
      } else {
        await log.refreshStatus();
      }
      return true;
    } catch (e) {
      setPending(entry);
      setNotice({
        text:
          e instanceof StorageQuotaError
            ? "Not saved: the device has no space left for the log. The entry is kept below; free some space and try again, or save it as a file."
            : `Not saved: ${message(e)}`,
        alert: true,
      });
      return false;
    }
  }

  /** Logs the estimate on screen once (sharing it again reuses the same entry). */
  async function logCurrent(withNote: string): Promise<LogEntry | null> {
    if (!scenario || !result) return null;
    if (lastLogged.current?.result === result && withNote === lastLogged.current.entry.note) {
      return lastLogged.current.entry;
    }
    const entry = draftEntry(scenario, result, withNote);
    lastLogged.current = { result, entry };
    if (await write(entry)) {
      setNotice({ text: `Logged: estimate of ${timeText(entry.time_local)}.` });
      setNote("");
    }
    return entry;
  }

  /** An entry for the estimate on screen (time stamp and place), not yet written. */
  const draftEntry = (scenario: Scenario, result: EstimateOutput, withNote: string) => {
    const src = scenario.source;
    return newEntry({
      scenario,
      result,
      place: src
        ? {
            lat: src.lat,
            lon: src.lon,
            // The device's accuracy, while the place is still the one the device gave.
            accuracy_m:
              positionFix && positionFix.lat === src.lat && positionFix.lon === src.lon
                ? positionFix.accuracyM
                : null,
          }
        : null,
      note: withNote.trim(),
    });
  };

  async function share(how: "share" | "copy", sc: Scenario, out: EstimateOutput, time: string) {
    const made = footprintFile(sc, out, time);
    if (!made) {
      setNotice({ text: "No source position: set the place to share a footprint.", alert: true });
      return;
    }
    if (how === "copy") {
      const ok = await copyText(made.file.text);
      setNotice(
        ok
          ? { text: `GeoJSON copied (${made.file.name}).` }
          : { text: "The browser did not allow copying.", alert: true },
      );
      return;
    }
    const outcome = await shareFile(made.file, "Driftmark footprint");
    setNotice({
      text:
        outcome === "shared"
          ? `Shared ${made.file.name}.`
          : outcome === "downloaded"
            ? `Saved ${made.file.name} (this device cannot share files).`
            : "Sharing cancelled.",
    });
  }

  async function shareCurrent(how: "share" | "copy") {
    if (!scenario || !result) return;
    const entry = await logCurrent(note);
    if (!entry) return;
    await share(how, scenario, result, entry.time_local);
  }

  async function open(s: LogSummary) {
    if (!log.store) return;
    try {
      const e = await log.store.get(s.id);
      setSelected(e ?? null);
      if (!e) log.removed(s.id);
    } catch (e) {
      setNotice({ text: message(e), alert: true });
    }
  }

  async function deleteSelected() {
    if (!log.store || !selected) return;
    try {
      const removed = await log.store.delete(selected.id);
      log.removed(selected.id);
      setSelected(null);
      setUndo(removed ?? null);
      setNotice({ text: "Entry deleted." });
      await log.refreshStatus();
    } catch (e) {
      setNotice({ text: message(e), alert: true });
    }
  }

  async function undoDelete() {
    if (!undo) return;
    if (await write(undo)) {
      setNotice({ text: `Entry of ${timeText(undo.time_local)} restored.` });
      setUndo(null);
    }
  }

  async function deleteAll() {
    if (!log.store || confirmText !== CONFIRM_WORD) return;
    try {
      const n = await log.store.deleteAll();
      setConfirming(false);
      setConfirmText("");
      setSelected(null);
      setUndo(null);
      await log.reload();
      await log.refreshStatus();
      setNotice({ text: `Deleted all ${n} entries.` });
    } catch (e) {
      setNotice({ text: message(e), alert: true });
    }
  }

  async function entriesToExport(): Promise<LogEntry[]> {
    if (!log.store) return [];
    if (onlyShown && filtering) {
      return (await log.store.exportBackup(filtered.map((s) => s.id))).entries;
    }
    return log.store.all();
  }

  async function exportBackup(kind: "json" | "geojson") {
    try {
      const entries = await entriesToExport();
      const now = new Date();
      if (kind === "json") {
        const f = backupFile(entries, now);
        downloadFile(f);
        setNotice({ text: `Saved ${f.name} (${entries.length} entries).` });
      } else {
        const fc = logGeoJSON(entries, now);
        const f = {
          name: logGeoJSONFileName(now),
          mime: GEOJSON_MIME,
          text: `${JSON.stringify(fc)}\n`,
        };
        downloadFile(f);
        setNotice({
          text: `Saved ${f.name} (${fc.features.length} of ${entries.length} entries have a place).`,
        });
      }
    } catch (e) {
      setNotice({ text: message(e), alert: true });
    }
  }

  async function importFile(input: HTMLInputElement) {
    const file = input.files?.[0];
    input.value = "";
    if (!file || !log.store) return;
    setSummary(null);
    try {
      const textRead = await readFileText(file, MAX_BACKUP_BYTES);
      const s = await log.store.importBackup(textRead);
      setSummary(s);
      await log.reload();
      await log.refreshStatus();
      setNotice({
        text: `Import: ${s.added} added, ${s.skipped_duplicates} already in the log, ${s.rejected.length} rejected.`,
      });
    } catch (e) {
      const why =
        e instanceof ImportFileError || e instanceof RangeError || e instanceof StorageQuotaError
          ? e.message
          : message(e);
      setNotice({ text: `Nothing imported: ${why}`, alert: true });
    }
  }

  const st = log.status;
  return (
    <section class="dm-log" aria-labelledby="dm-log-title">
      <h2 id="dm-log-title">Log</h2>
      <p class="dm-log-caution">{CAUTION}</p>

      <div class="dm-log-new">
        <label for="dm-log-note">Note (optional)</label>
        <input
          id="dm-log-note"
          type="text"
          maxLength={1000}
          value={note}
          onInput={(e) => setNote((e.currentTarget as HTMLInputElement).value)}
        />
        <div class="dm-log-actions">
          <button
            type="button"
            disabled={!scenario || !result}
            onClick={() => void logCurrent(note)}
          >
            Log this estimate
          </button>
          <button
            type="button"
            class="secondary"
            disabled={!canShareCurrent}
            onClick={() => void shareCurrent("share")}
          >
            Share footprint
          </button>
          <button
            type="button"
            class="secondary"
            disabled={!canShareCurrent}
            onClick={() => void shareCurrent("copy")}
          >
            Copy GeoJSON
          </button>
          <button
            type="button"
            class="secondary"
            disabled={!scenario || !result}
            onClick={() => {
              if (scenario && result) {
                printEntry(draftEntry(scenario, result, note), result, units).catch((e) =>
                  setNotice({
                    text: `The estimate sheet could not be opened: ${message(e)}`,
                    alert: true,
                  }),
                );
              }
            }}
          >
            Print this estimate
          </button>
        </div>
        {!result ? (
          <p class="hint">Nothing to log until the estimate is up to date.</p>
        ) : !canShareCurrent ? (
          <p class="hint">To share a footprint, give the source position (place).</p>
        ) : (
          <p class="hint">Sharing also logs the estimate. Shared files carry the caution.</p>
        )}
      </div>

      <div class="dm-log-status" aria-live="polite">
        {notice ? <p role={notice.alert ? "alert" : "status"}>{notice.text}</p> : null}
        {undo ? (
          <button type="button" class="secondary" onClick={() => void undoDelete()}>
            Undo delete
          </button>
        ) : null}
      </div>

      {pending ? (
        <div class="dm-log-pending" data-testid="log-pending">
          <p>
            Not yet in the log: estimate of {timeText(pending.time_local)}
            {pending.note ? `, note “${pending.note}”` : ""}.
          </p>
          <div class="dm-log-actions">
            <button type="button" onClick={() => void write(pending)}>
              Try again to log it
            </button>
            <button
              type="button"
              class="secondary"
              onClick={() => downloadFile(backupFile([pending], new Date()))}
            >
              Save it as a file
            </button>
          </div>
        </div>
      ) : null}

      <h3>Entries</h3>
      <div class="dm-log-filter">
        <div>
          <label for="dm-log-text">Filter by text</label>
          <input
            id="dm-log-text"
            type="text"
            value={text}
            onInput={(e) => setText((e.currentTarget as HTMLInputElement).value)}
          />
        </div>
        <div>
          <label for="dm-log-day">Day</label>
          <input
            id="dm-log-day"
            type="date"
            value={day}
            onInput={(e) => setDay((e.currentTarget as HTMLInputElement).value)}
          />
        </div>
        {filtering ? (
          <button
            type="button"
            class="secondary"
            onClick={() => {
              setText("");
              setDay("");
            }}
          >
            Clear filter
          </button>
        ) : null}
      </div>
      <p data-testid="log-count">
        {log.loading
          ? "Reading the log…"
          : filtering
            ? `${filtered.length} of ${log.summaries.length} entries shown.`
            : `${log.summaries.length} ${log.summaries.length === 1 ? "entry" : "entries"}.`}
      </p>
      {log.problem ? <p role="alert">The log cannot be used: {log.problem}</p> : null}
      {filtered.length > 0 ? (
        <WindowedList
          items={filtered}
          rowHeight={ROW_HEIGHT}
          height={Math.min(6, filtered.length) * ROW_HEIGHT}
          label="Logged estimates, newest first"
          keyOf={(s) => s.id}
          renderRow={(s) => (
            <button
              type="button"
              class="dm-log-rowbtn secondary"
              aria-current={selected?.id === s.id ? "true" : undefined}
              onClick={() => void open(s)}
            >
              <span class="dm-log-line dm-log-time">{timeText(s.time_local)}</span>
              <span class="dm-log-line">
                {s.place}
                {s.note ? ` — ${s.note}` : ""}
              </span>
              <span class="dm-log-line dm-log-fig">{s.figures}</span>
            </button>
          )}
        />
      ) : null}

      {selected ? (
        <EntryDetail
          entry={selected}
          onReopen={() => {
            onReopen(structuredClone(selected.scenario));
            setNotice({ text: "The entry's inputs are on screen as a new estimate." });
          }}
          onShare={(e, out) => void share("share", e.scenario, out, e.time_local)}
          onCopy={(e, out) => void share("copy", e.scenario, out, e.time_local)}
          onPrint={(e, out) =>
            printEntry(e, out, units).catch((err) =>
              setNotice({
                text: `The estimate sheet could not be opened: ${message(err)}`,
                alert: true,
              }),
            )
          }
          onDelete={() => void deleteSelected()}
          onClose={() => setSelected(null)}
        />
      ) : null}

      <h3>Backup</h3>
      {filtering ? (
        <label class="dm-log-check">
          <input
            type="checkbox"
            checked={onlyShown}
            onChange={(e) => setOnlyShown((e.currentTarget as HTMLInputElement).checked)}
          />
          Export only the entries shown
        </label>
      ) : null}
      <div class="dm-log-actions">
        <button type="button" class="secondary" onClick={() => void exportBackup("json")}>
          Export backup (JSON)
        </button>
        <button type="button" class="secondary" onClick={() => void exportBackup("geojson")}>
          Export log as GeoJSON
        </button>
        <label class="button-link dm-log-import">
          Import backup
          <input
            type="file"
            accept=".json,application/json"
            class="dm-visually-hidden"
            data-testid="log-import"
            onChange={(e) => void importFile(e.currentTarget as HTMLInputElement)}
          />
        </label>
      </div>
      {summary ? (
        <div class="dm-log-summary" data-testid="import-summary">
          <p>
            Added {summary.added}; already in the log {summary.skipped_duplicates}; rejected{" "}
            {summary.rejected.length}.
          </p>
          {summary.rejected.length > 0 ? (
            <ul aria-label="Rejected entries">
              {summary.rejected.slice(0, MAX_REJECTIONS_SHOWN).map((r) => (
                <li key={r.index}>
                  Entry {r.index + 1}
                  {r.id ? ` (${r.id})` : ""}: {r.reason}
                </li>
              ))}
              {summary.rejected.length > MAX_REJECTIONS_SHOWN ? (
                <li>… and {summary.rejected.length - MAX_REJECTIONS_SHOWN} more.</li>
              ) : null}
            </ul>
          ) : null}
        </div>
      ) : null}

      <h3>Storage</h3>
      <p data-testid="storage-status">
        {!st
          ? "Checking storage…"
          : !st.supported
            ? "This browser does not report storage."
            : `${
                st.persisted === true
                  ? "Kept: the browser will not clear the log on its own."
                  : st.persisted === false
                    ? "Not guaranteed: the browser may clear the log when space runs short."
                    : "Unknown whether the browser keeps the log."
              } Space used: ${formatBytes(st.usage_bytes)}${
                st.quota_bytes !== null ? ` of ${formatBytes(st.quota_bytes)}` : ""
              }.`}
      </p>
      {st?.supported && st.persisted !== true ? (
        <button type="button" class="secondary" onClick={() => void log.askPersistence()}>
          Ask to keep the log
        </button>
      ) : null}

      <div class="dm-log-danger">
        {!confirming ? (
          <button
            type="button"
            class="secondary"
            disabled={log.summaries.length === 0}
            onClick={() => setConfirming(true)}
          >
            Delete all entries…
          </button>
        ) : (
          <div>
            <label for="dm-log-confirm">
              Type {CONFIRM_WORD} to delete all {log.summaries.length} entries
            </label>
            <input
              id="dm-log-confirm"
              type="text"
              autoComplete="off"
              value={confirmText}
              onInput={(e) => setConfirmText((e.currentTarget as HTMLInputElement).value)}
            />
            <div class="dm-log-actions">
              <button
                type="button"
                disabled={confirmText !== CONFIRM_WORD}
                onClick={() => void deleteAll()}
              >
                Delete all
              </button>
              <button
                type="button"
                class="secondary"
                onClick={() => {
                  setConfirming(false);
                  setConfirmText("");
                }}
              >
                Keep the log
              </button>
            </div>
          </div>
        )}
      </div>
    </section>
  );
}
