/**
 * Limit sets in the Limits section: the "Limit set" search-as-you-type field that fills the limits
 * and the molecular weight in one tap, and (folded away) saving, editing, deleting, importing and
 * exporting sets. Loaded after the first estimate; storage is the limit-sets store of the log's
 * database.
 */
import { useEffect, useMemo, useRef, useState } from "preact/hooks";
import { JSON_MIME, type OutFile } from "../../export/files.ts";
import { downloadFile } from "../../export/share.ts";
import { LimitSetStore, type NameClash, searchSets } from "../../storage/limit-set-store.ts";
import {
  DEMO_LIMIT_SET,
  type LimitSet,
  type LimitSetData,
  LimitSetFileError,
  limitSetsFileName,
  MAX_FILE_BYTES,
  readLimitSetsFile,
  writeLimitSetsCsv,
  writeLimitSetsJson,
} from "../../storage/limit-sets.ts";
import type { FormState } from "../form.ts";
import type { Action } from "../store.ts";
import { applySet, setFromForm } from "./fill.ts";
import "./limitsets.css";

export interface LimitSetPanelProps {
  form: FormState;
  dispatch: (a: Action) => void;
}

const INPUT_ID = "limit-set";
const LIST_ID = "limit-set-options";

function describe(set: LimitSet): string {
  const mw = set.molecular_weight_g_mol === null ? "" : `, ${set.molecular_weight_g_mol} g/mol`;
  return `${set.limits.length} limit${set.limits.length === 1 ? "" : "s"}${mw}`;
}

export function LimitSetPanel({ form, dispatch }: LimitSetPanelProps) {
  const [stored, setStored] = useState<LimitSet[]>([]);
  const [storeError, setStoreError] = useState<string | null>(null);
  const [query, setQuery] = useState("");
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(0);
  /** The set last chosen (for editing). */
  const [chosen, setChosen] = useState<LimitSet | null>(null);
  const [notice, setNotice] = useState<{ text: string; alert?: boolean } | null>(null);
  const [fileProblems, setFileProblems] = useState<string[]>([]);
  const [pending, setPending] = useState<{ sets: LimitSetData[]; clashes: string[] } | null>(null);
  const [undo, setUndo] = useState<LimitSet | null>(null);
  const [saveName, setSaveName] = useState("");
  const [saveNote, setSaveNote] = useState("");
  const store = useRef<Promise<LimitSetStore> | null>(null);
  const getStore = () => {
    store.current ??= LimitSetStore.open();
    return store.current;
  };
  const reload = async () => {
    try {
      setStored(await (await getStore()).all());
      setStoreError(null);
    } catch (e) {
      setStoreError(e instanceof Error ? e.message : String(e));
    }
  };
  useEffect(() => {
    void reload();
  }, []);

  // The estimate records the set only while the limits and weight are still the set's: an edit
  // by hand after choosing it drops the record.
  const filled = useRef<string | null>(null);
  const now = JSON.stringify([form.limits, form.molecularWeight]);
  useEffect(() => {
    if (!form.limitSet) filled.current = null;
    else if (filled.current === null) filled.current = now;
    else if (filled.current !== now) {
      filled.current = null;
      dispatch({ type: "set", key: "limitSet", value: null });
    }
  }, [now, form.limitSet]);

  const all = useMemo(() => [DEMO_LIMIT_SET, ...stored], [stored]);
  const options = useMemo(() => searchSets(all, query, 30), [all, query]);

  const choose = (set: LimitSet) => {
    filled.current = null;
    applySet(set, dispatch);
    setChosen(set);
    setQuery(set.name);
    setOpen(false);
    setSaveName(set.invented ? "" : set.name);
    setSaveNote(set.invented ? "" : set.source_note);
    setNotice(null);
  };

  const onKey = (e: KeyboardEvent) => {
    if (e.key === "ArrowDown") {
      e.preventDefault();
      setOpen(true);
      setActive((a) => Math.min(a + 1, options.length - 1));
    } else if (e.key === "ArrowUp") {
      e.preventDefault();
      setActive((a) => Math.max(a - 1, 0));
    } else if (e.key === "Enter") {
      const o = options[active];
      if (open && o) {
        e.preventDefault();
        choose(o);
      }
    } else if (e.key === "Escape") {
      setOpen(false);
    }
  };

  const save = async (mode: "new" | "update") => {
    const r = setFromForm(form, saveName, saveNote);
    if (!r.ok) return setNotice({ text: r.message, alert: true });
    try {
      const s = await getStore();
      const saved =
        mode === "update" && chosen && !chosen.invented
          ? await s.update(chosen.id, r.set)
          : await s.add(r.set);
      setChosen(saved);
      await reload();
      filled.current = null;
      applySet(saved, dispatch);
      setQuery(saved.name);
      setNotice({
        text:
          mode === "update" ? `Saved the changes to '${saved.name}'.` : `Saved '${saved.name}'.`,
      });
    } catch (e) {
      setNotice({ text: e instanceof Error ? e.message : String(e), alert: true });
    }
  };

  const remove = async () => {
    if (!chosen || chosen.invented) return;
    try {
      const gone = await (await getStore()).delete(chosen.id);
      setUndo(gone ?? null);
      setChosen(null);
      setQuery("");
      await reload();
      setNotice({ text: `Deleted '${chosen.name}'.` });
    } catch (e) {
      setNotice({ text: e instanceof Error ? e.message : String(e), alert: true });
    }
  };

  const importSets = async (sets: LimitSetData[], clash: NameClash) => {
    try {
      const r = await (await getStore()).importSets(sets, clash);
      setPending(null);
      await reload();
      setNotice({
        text: `Imported ${r.added} limit set${r.added === 1 ? "" : "s"}${r.replaced ? ` (replaced ${r.replaced})` : ""}.`,
      });
    } catch (e) {
      setNotice({ text: e instanceof Error ? e.message : String(e), alert: true });
    }
  };

  const onFile = async (input: HTMLInputElement) => {
    const file = input.files?.[0];
    input.value = "";
    if (!file) return;
    setFileProblems([]);
    setNotice(null);
    setPending(null);
    try {
      // Too big: refused from its size alone, before its text is read.
      if (file.size > MAX_FILE_BYTES) readLimitSetsFile(file.name, "", file.size);
      const sets = readLimitSetsFile(file.name, await file.text(), file.size);
      const clashes = await (await getStore()).clashes(sets);
      if (clashes.length > 0) setPending({ sets, clashes });
      else await importSets(sets, "keep-both");
    } catch (e) {
      if (e instanceof LimitSetFileError) {
        setFileProblems(e.message.split("\n"));
      } else setNotice({ text: e instanceof Error ? e.message : String(e), alert: true });
    }
  };

  const exportAs = (kind: "csv" | "json") => {
    const now = new Date();
    const f: OutFile =
      kind === "csv"
        ? { name: limitSetsFileName(now, "csv"), mime: "text/csv", text: writeLimitSetsCsv(stored) }
        : {
            name: limitSetsFileName(now, "json"),
            mime: JSON_MIME,
            text: writeLimitSetsJson(stored, now),
          };
    downloadFile(f);
  };

  const recorded = form.limitSet;
  const activeId = open && options[active] ? `${LIST_ID}-${active}` : undefined;
  return (
    <div class="dm-sets" data-testid="limit-sets">
      <div class="field dm-sets-pick">
        <label for={INPUT_ID}>Limit set</label>
        <input
          id={INPUT_ID}
          type="text"
          role="combobox"
          autocomplete="off"
          aria-autocomplete="list"
          aria-expanded={open}
          aria-controls={LIST_ID}
          aria-activedescendant={activeId}
          aria-describedby={`${INPUT_ID}-hint`}
          value={query}
          onInput={(e) => {
            setQuery(e.currentTarget.value);
            setOpen(true);
            setActive(0);
          }}
          onFocus={() => setOpen(true)}
          onKeyDown={onKey}
        />
        <p class="hint" id={`${INPUT_ID}-hint`}>
          {recorded
            ? `Limits from '${recorded.name}'${recorded.source_note ? ` (source: ${recorded.source_note})` : ""}.`
            : "Type part of a name to fill the limits and molecular weight from a saved set."}
        </p>
        {open && options.length > 0 ? (
          <div class="dm-sets-options" id={LIST_ID} role="listbox" aria-label="Limit sets">
            {options.map((s, i) => (
              // biome-ignore lint/a11y/useKeyWithClickEvents: the combobox input handles the keys
              <div
                key={s.id}
                id={`${LIST_ID}-${i}`}
                role="option"
                tabIndex={-1}
                aria-selected={i === active}
                class={i === active ? "is-active" : undefined}
                onMouseDown={(e) => e.preventDefault()}
                onClick={() => choose(s)}
              >
                <span class="dm-sets-name">{s.name}</span>{" "}
                <span class="dm-sets-meta">{describe(s)}</span>
              </div>
            ))}
          </div>
        ) : null}
        {open && query.trim() !== "" && options.length === 0 ? (
          <p class="hint" role="status">
            No limit set matches '{query.trim()}'.
          </p>
        ) : null}
      </div>
      {storeError ? (
        <p role="alert">Limit sets cannot be read on this device: {storeError}</p>
      ) : null}
      <details class="dm-sets-manage">
        <summary>Manage limit sets ({stored.length} saved)</summary>
        <div class="field">
          <label for="limit-set-name">Set name</label>
          <input
            id="limit-set-name"
            type="text"
            value={saveName}
            maxLength={120}
            onInput={(e) => setSaveName(e.currentTarget.value)}
          />
        </div>
        <div class="field">
          <label for="limit-set-note">Source note</label>
          <input
            id="limit-set-note"
            type="text"
            value={saveNote}
            maxLength={1000}
            aria-describedby="limit-set-note-hint"
            onInput={(e) => setSaveNote(e.currentTarget.value)}
          />
          <p class="hint" id="limit-set-note-hint">
            Where the values come from, e.g. your agency's list and its date.
          </p>
        </div>
        <div class="dm-sets-actions">
          <button type="button" onClick={() => void save("new")}>
            Save as limit set
          </button>
          {chosen && !chosen.invented ? (
            <>
              <button type="button" class="secondary" onClick={() => void save("update")}>
                Save changes to '{chosen.name}'
              </button>
              <button type="button" class="secondary" onClick={() => void remove()}>
                Delete '{chosen.name}'
              </button>
            </>
          ) : null}
        </div>
        <p class="hint">
          Saving takes the limits and molecular weight above. To edit a set, choose it, change the
          limits above, then save the changes.
        </p>
        {notice ? <p role={notice.alert ? "alert" : "status"}>{notice.text}</p> : null}
        {undo ? (
          <button
            type="button"
            class="secondary"
            onClick={async () => {
              await (await getStore()).restore(undo);
              setUndo(null);
              await reload();
              setNotice({ text: `Restored '${undo.name}'.` });
            }}
          >
            Undo delete
          </button>
        ) : null}
        <div class="field">
          <label for="limit-sets-file">Limit sets file</label>
          <input
            id="limit-sets-file"
            type="file"
            accept=".csv,.json,text/csv,application/json"
            aria-describedby="limit-sets-file-hint"
            onChange={(e) => void onFile(e.currentTarget)}
          />
          <p class="hint" id="limit-sets-file-hint">
            CSV with the columns
            set_name,molecular_weight_g_mol,limit_label,value,unit,averaging_min,source_note, or a
            Driftmark limit sets JSON file; at most 2,000 sets and 5 MB.
          </p>
        </div>
        {fileProblems.length > 0 ? (
          <div role="alert" class="dm-sets-problems" data-testid="limit-sets-problems">
            <p>{fileProblems[0]}</p>
            <ul>
              {fileProblems.slice(1).map((p) => (
                <li key={p}>{p}</li>
              ))}
            </ul>
          </div>
        ) : null}
        {pending ? (
          <div role="alert" class="dm-sets-clash">
            <p>
              {pending.clashes.length === 1
                ? `A set named '${pending.clashes[0]}' is already saved.`
                : `${pending.clashes.length} sets in the file have names already saved (${pending.clashes.slice(0, 3).join(", ")}${pending.clashes.length > 3 ? ", …" : ""}).`}{" "}
              Keep both, or replace the saved ones?
            </p>
            <div class="dm-sets-actions">
              <button type="button" onClick={() => void importSets(pending.sets, "keep-both")}>
                Keep both
              </button>
              <button
                type="button"
                class="secondary"
                onClick={() => void importSets(pending.sets, "replace")}
              >
                Replace
              </button>
              <button type="button" class="secondary" onClick={() => setPending(null)}>
                Cancel import
              </button>
            </div>
          </div>
        ) : null}
        <div class="dm-sets-actions">
          {(["csv", "json"] as const).map((kind) => (
            <button
              key={kind}
              type="button"
              class="secondary"
              disabled={stored.length === 0}
              onClick={() => exportAs(kind)}
            >
              Export limit sets ({kind.toUpperCase()})
            </button>
          ))}
        </div>
        <p class="hint">
          Driftmark ships no substance data: only the invented demo set, '{DEMO_LIMIT_SET.name}'.
        </p>
      </details>
    </div>
  );
}
