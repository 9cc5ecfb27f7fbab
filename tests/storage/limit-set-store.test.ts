import "fake-indexeddb/auto";
import { describe, expect, it } from "vitest";
import { LimitSetStore, searchSets } from "../../src/storage/limit-set-store.ts";
import { type LimitSetData, readLimitSetsCsv } from "../../src/storage/limit-sets.ts";
import { LogStore } from "../../src/storage/log.ts";
import { dbName, entryAt } from "./fixtures.ts";
import { inventedCsv, inventedSets } from "./limit-set-fixtures.ts";

const gas = (name: string, value = 5): LimitSetData => ({
  name,
  molecular_weight_g_mol: 17,
  source_note: "Invented list",
  limits: [{ label: "Tier 1", value, unit: "ppm", averaging_min: 60 }],
});

describe("limit set store", () => {
  it("adds, edits and deletes a set, beside the log and without touching it", async () => {
    const name = dbName();
    const log = await LogStore.open(name);
    await log.add(entryAt(Date.UTC(2026, 0, 1)));
    const store = await LimitSetStore.open(name);
    const a = await store.add(gas("Gas A (invented)"));
    expect(a.id).toMatch(/^[0-9a-f-]{36}$/);
    expect(await store.get(a.id)).toEqual(a);
    const edited = await store.update(a.id, gas("Gas A (invented)", 7));
    expect((await store.get(a.id))?.limits[0]?.value).toBe(7);
    expect(edited.id).toBe(a.id);
    const gone = await store.delete(a.id);
    expect(gone?.limits[0]?.value).toBe(7);
    expect(await store.count()).toBe(0);
    if (gone) await store.restore(gone);
    expect(await store.count()).toBe(1);
    expect(await log.count()).toBe(1);
    log.close();
  });

  it("imports 500 sets in one go and lists them by name", async () => {
    const store = await LimitSetStore.open(dbName());
    const sets = readLimitSetsCsv(inventedCsv(inventedSets(500)));
    const r = await store.importSets(sets, "keep-both");
    expect(r).toEqual({ added: 500, replaced: 0 });
    const all = await store.all();
    expect(all).toHaveLength(500);
    expect(all.map((s) => s.name)).toEqual(
      sets.map((s) => s.name).sort((x, y) => x.localeCompare(y, "en", { sensitivity: "base" })),
    );
  });

  it("a name already stored: keep both, or replace", async () => {
    const store = await LimitSetStore.open(dbName());
    await store.add(gas("Gas A (invented)", 1));
    await store.add(gas("Gas B (invented)", 2));
    expect(await store.clashes([gas("Gas A (invented)"), gas("Gas C (invented)")])).toEqual([
      "Gas A (invented)",
    ]);
    await store.importSets([gas("Gas A (invented)", 3)], "keep-both");
    expect((await store.all()).filter((s) => s.name === "Gas A (invented)")).toHaveLength(2);
    const r = await store.importSets([gas("Gas A (invented)", 4)], "replace");
    expect(r).toEqual({ added: 1, replaced: 2 });
    const a = (await store.all()).filter((s) => s.name === "Gas A (invented)");
    expect(a.map((s) => s.limits[0]?.value)).toEqual([4]);
    expect(await store.count()).toBe(2);
  });

  it("search puts names starting with the text first, ignoring case and accents", () => {
    const sets = [{ name: "Zeta gas" }, { name: "Gás Q" }, { name: "Other" }, { name: "Big gas" }];
    expect(searchSets(sets, "ga").map((s) => s.name)).toEqual(["Gás Q", "Zeta gas", "Big gas"]);
    expect(searchSets(sets, "").length).toBe(4);
    expect(searchSets(sets, "xyz")).toEqual([]);
  });
});
