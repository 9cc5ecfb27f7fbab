/** The estimate sheet of a log entry (or of the estimate on screen, as an entry not yet written). */
import type { EstimateOutput } from "../../core/types.ts";
import type { LogEntry } from "../../storage/schema.ts";
import type { UnitSystem } from "../units.ts";
import type { SheetProps } from "./EstimateSheet.tsx";

/**
 * @param output the estimate recomputed from the entry's inputs: its footprint is drawn; the
 *   figures shown are the entry's, exactly as logged
 */
export function sheetOfEntry(e: LogEntry, output: EstimateOutput, units: UnitSystem): SheetProps {
  return {
    scenario: e.scenario,
    output,
    logged: e.results,
    timeLocal: e.time_local,
    place: e.place,
    note: e.note,
    units,
  };
}
