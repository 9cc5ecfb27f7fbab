/** The log as the view sees it: the store, the newest-first summaries, and storage status. */
import { useCallback, useEffect, useRef, useState } from "preact/hooks";
import { LogStore } from "../../storage/log.ts";
import { requestPersistence, type StorageStatus, storageStatus } from "../../storage/persist.ts";
import type { LogEntry } from "../../storage/schema.ts";
import { insertSorted, type LogSummary, summarise } from "./summary.ts";

export interface LogState {
  store: LogStore | null;
  summaries: LogSummary[];
  loading: boolean;
  /** A problem opening or reading the log, in words. */
  problem: string | null;
  status: StorageStatus | null;
  /** Remembers a new entry in the view (after it was written). */
  added: (e: LogEntry) => void;
  removed: (id: string) => void;
  reload: () => Promise<void>;
  refreshStatus: () => Promise<void>;
  askPersistence: () => Promise<void>;
}

/** Entries read before the list first shows. */
const FIRST_PAGE = 50;

export function useLog(): LogState {
  const [store, setStore] = useState<LogStore | null>(null);
  const [summaries, setSummaries] = useState<LogSummary[]>([]);
  const [loading, setLoading] = useState(true);
  const [problem, setProblem] = useState<string | null>(null);
  const [status, setStatus] = useState<StorageStatus | null>(null);
  const storeRef = useRef<LogStore | null>(null);

  const refreshStatus = useCallback(async () => setStatus(await storageStatus()), []);

  const reload = useCallback(async () => {
    const s = storeRef.current;
    if (!s) return;
    setLoading(true);
    try {
      // The newest entries show as soon as the first page is read; then the whole log is read
      // in one request (far faster than stepping a cursor through thousands of entries).
      const first = await s.list({ limit: FIRST_PAGE });
      setSummaries(first.entries.map(summarise));
      setLoading(false);
      if (first.next) setSummaries((await s.all()).map(summarise));
      setProblem(null);
    } catch (e) {
      setProblem(e instanceof Error ? e.message : String(e));
    } finally {
      setLoading(false);
    }
  }, []);

  useEffect(() => {
    let live = true;
    LogStore.open()
      .then(async (s) => {
        if (!live) return;
        storeRef.current = s;
        setStore(s);
        await reload();
      })
      .catch((e: unknown) => {
        if (!live) return;
        setProblem(e instanceof Error ? e.message : String(e));
        setLoading(false);
      });
    void refreshStatus();
    return () => {
      live = false;
    };
  }, [reload, refreshStatus]);

  const added = useCallback((e: LogEntry) => {
    setSummaries((list) => insertSorted(list, summarise(e)));
  }, []);
  const removed = useCallback((id: string) => {
    setSummaries((list) => list.filter((s) => s.id !== id));
  }, []);
  const askPersistence = useCallback(async () => {
    await requestPersistence();
    await refreshStatus();
  }, [refreshStatus]);

  return {
    store,
    summaries,
    loading,
    problem,
    status,
    added,
    removed,
    reload,
    refreshStatus,
    askPersistence,
  };
}
