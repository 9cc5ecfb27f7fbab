import { describe, expect, it } from "vitest";
import { parseCsv } from "../../src/storage/csv.ts";
import {
  CSV_COLUMNS,
  type LimitSetData,
  LimitSetFileError,
  readLimitSetsCsv,
  readLimitSetsFile,
  readLimitSetsJson,
  writeLimitSetsCsv,
  writeLimitSetsJson,
} from "../../src/storage/limit-sets.ts";
import { inventedCsv, inventedSets } from "./limit-set-fixtures.ts";

const HEADER = CSV_COLUMNS.join(",");
const NOW = new Date(Date.UTC(2026, 11, 3, 12, 0, 0));

/** The problems of a refused file (fails the test if the file is accepted). */
function refused(read: () => unknown): string {
  try {
    read();
  } catch (e) {
    expect(e).toBeInstanceOf(LimitSetFileError);
    return (e as Error).message;
  }
  throw new Error("the file was accepted");
}
const csv = (...rows: string[]) => [HEADER, ...rows].join("\r\n");

describe("CSV reader (RFC 4180)", () => {
  it("splits quoted fields holding commas, quotes and line breaks, and keeps each record's line", () => {
    expect(() => parseCsv('x,"y" z')).toThrow(/follows a closing quote/);
    const good = parseCsv('a,"b,1","say ""hi"""\r\n"two\nlines",x,\n\nlast,,""');
    expect(good).toEqual([
      { line: 1, fields: ["a", "b,1", 'say "hi"'] },
      { line: 2, fields: ["two\nlines", "x", ""] },
      { line: 5, fields: ["last", "", ""] },
    ]);
  });

  it("accepts a byte order mark, LF or CRLF, and no line end after the last record", () => {
    expect(parseCsv("\uFEFFa,b\r\nc,d")).toEqual([
      { line: 1, fields: ["a", "b"] },
      { line: 2, fields: ["c", "d"] },
    ]);
    expect(parseCsv("a,b\nc,d\n")).toEqual(parseCsv("a,b\r\nc,d\r\n"));
  });

  it("refuses an unclosed quote, naming its line and field", () => {
    expect(() => parseCsv('a,b\nc,"d\n')).toThrow(/not closed/);
    try {
      parseCsv('a,b\nc,"d\n');
    } catch (e) {
      expect(e).toMatchObject({ line: 2, column: 2 });
    }
  });
});

describe("limit sets CSV import", () => {
  it("reads rows with the same set_name as one set, in the order of first appearance", () => {
    const sets = readLimitSetsCsv(
      csv(
        "Gas Q (invented),17,Tier 1,5,ppm,60,Invented list",
        "Gas R (invented),,Tier 1,40,mg/m3,30,",
        "Gas Q (invented),17,Tier 2,50,ppm,10,Invented list",
      ),
    );
    expect(sets).toEqual<LimitSetData[]>([
      {
        name: "Gas Q (invented)",
        molecular_weight_g_mol: 17,
        source_note: "Invented list",
        limits: [
          { label: "Tier 1", value: 5, unit: "ppm", averaging_min: 60 },
          { label: "Tier 2", value: 50, unit: "ppm", averaging_min: 10 },
        ],
      },
      {
        name: "Gas R (invented)",
        molecular_weight_g_mol: null,
        source_note: "",
        limits: [{ label: "Tier 1", value: 40, unit: "mg/m3", averaging_min: 30 }],
      },
    ]);
  });

  it("imports a CSV of 500 invented sets (BOM, CRLF, quoted fields), every limit as written", () => {
    const fixture = inventedSets(500);
    const sets = readLimitSetsCsv(inventedCsv(fixture, { bom: true }));
    expect(sets).toHaveLength(500);
    sets.forEach((s, i) => {
      const f = fixture[i];
      expect(s.name).toBe(f?.name);
      expect(s.molecular_weight_g_mol).toBe(f?.mw === "" ? null : Number(f?.mw));
      expect(s.source_note).toBe(f?.note);
      expect(s.limits).toEqual(
        f?.limits.map((l) => ({
          label: l.label,
          value: Number(l.value),
          unit: l.unit,
          averaging_min: Number(l.averaging_min),
        })),
      );
    });
  });

  it("round-trips each of the 500 sets' limits CSV → JSON → CSV unchanged", () => {
    const first = readLimitSetsCsv(inventedCsv(inventedSets(500)));
    const json = writeLimitSetsJson(first, NOW);
    const fromJson = readLimitSetsJson(json);
    expect(fromJson).toEqual(first);
    const csvAgain = writeLimitSetsCsv(fromJson);
    expect(csvAgain).toBe(writeLimitSetsCsv(first));
    // And the written CSV reads back to the very same sets.
    expect(readLimitSetsCsv(csvAgain)).toEqual(first);
    const limits = first.flatMap((s) => s.limits);
    const again = readLimitSetsCsv(csvAgain).flatMap((s) => s.limits);
    expect(again).toHaveLength(limits.length);
    for (const [i, l] of limits.entries()) expect(again[i]).toEqual(l);
  });

  it("the JSON file is typed and versioned", () => {
    const text = writeLimitSetsJson(readLimitSetsCsv(csv("A (invented),,L,1,mg/m3,60,n")), NOW);
    expect(JSON.parse(text)).toMatchObject({
      format: "driftmark-limit-sets",
      version: 1,
      exported_utc: NOW.toISOString(),
      sets: [{ name: "A (invented)", molecular_weight_g_mol: null, source_note: "n" }],
    });
  });

  it("picks the format by file name or content", () => {
    const sets = readLimitSetsCsv(csv("A (invented),,L,1,mg/m3,60,n"));
    expect(readLimitSetsFile("x.json", writeLimitSetsJson(sets, NOW))).toEqual(sets);
    expect(readLimitSetsFile("x.txt", writeLimitSetsJson(sets, NOW))).toEqual(sets);
    expect(readLimitSetsFile("x.csv", writeLimitSetsCsv(sets))).toEqual(sets);
  });
});

describe("a bad limit sets file changes nothing and says where it is wrong", () => {
  it("missing header", () => {
    const msg = refused(() => readLimitSetsCsv("Gas (invented),17,Tier 1,5,ppm,60,note\r\n"));
    expect(msg).toMatch(/Row 1: the header row is missing/);
  });

  it("empty file", () => {
    expect(refused(() => readLimitSetsCsv(""))).toMatch(/Row 1: the file is empty/);
  });

  it("missing column", () => {
    const header = CSV_COLUMNS.filter((c) => c !== "unit").join(",");
    const msg = refused(() => readLimitSetsCsv(`${header}\r\nG,17,T,5,60,n\r\n`));
    expect(msg).toMatch(/Row 1, column unit: this column is missing/);
  });

  it("unknown column", () => {
    const msg = refused(() => readLimitSetsCsv(`${HEADER},extra\r\nG,17,T,5,ppm,60,n,x\r\n`));
    expect(msg).toMatch(/Row 1, column extra: unknown column/);
  });

  it("row with a missing field", () => {
    const msg = refused(() => readLimitSetsCsv(csv("G,17,T,5,ppm,60,n", "G,17,U,5,ppm,60")));
    expect(msg).toMatch(/Row 3: this row has 6 fields; the header has 7/);
  });

  it("value not a positive number", () => {
    const msg = refused(() =>
      readLimitSetsCsv(csv("G,17,T1,abc,ppm,60,n", "G,17,T2,-3,ppm,60,n", "G,17,T3,0,ppm,60,n")),
    );
    expect(msg).toMatch(/Row 2, column value: 'abc' is not a positive number/);
    expect(msg).toMatch(/Row 3, column value: -3 is not a positive number/);
    expect(msg).toMatch(/Row 4, column value: 0 is not a positive number/);
  });

  it("unknown unit", () => {
    const msg = refused(() => readLimitSetsCsv(csv("G,17,T,5,ppb,60,n")));
    expect(msg).toMatch(/Row 2, column unit: unknown unit 'ppb': use ppm or mg\/m3/);
  });

  it("ppm limit in a set without molecular weight", () => {
    const msg = refused(() => readLimitSetsCsv(csv("G,,T1,5,mg/m3,60,n", "G,,T2,5,ppm,60,n")));
    expect(msg).toMatch(/Row 3, column unit: ppm limit in set 'G', which has no molecular weight/);
  });

  it("duplicate limit labels in one set", () => {
    const msg = refused(() =>
      readLimitSetsCsv(
        csv("G,17,Tier 1,5,ppm,60,n", "H,17,Tier 1,5,ppm,60,n", "G,17,Tier 1,9,ppm,10,n"),
      ),
    );
    expect(msg).toMatch(
      /Row 4, column limit_label: duplicate limit label 'Tier 1' in set 'G' \(also on row 2\)/,
    );
    expect(msg).not.toMatch(/Row 3/);
  });

  it("averaging time outside 1 min to 24 h", () => {
    const msg = refused(() =>
      readLimitSetsCsv(csv("G,17,T1,5,ppm,0.5,n", "G,17,T2,5,ppm,1441,n", "G,17,T3,5,ppm,soon,n")),
    );
    expect(msg).toMatch(
      /Row 2, column averaging_min: averaging time 0.5 min is outside 1 min to 24 h/,
    );
    expect(msg).toMatch(
      /Row 3, column averaging_min: averaging time 1441 min is outside 1 min to 24 h/,
    );
    expect(msg).toMatch(/Row 4, column averaging_min: 'soon' is not a number of minutes/);
  });

  it("the limits at the edges of 1 min and 24 h are accepted", () => {
    const sets = readLimitSetsCsv(csv("G,17,T1,5,ppm,1,n", "G,17,T2,5,ppm,1440,n"));
    expect(sets[0]?.limits.map((l) => l.averaging_min)).toEqual([1, 1440]);
  });

  it("more than 2,000 sets", () => {
    const rows = Array.from({ length: 2001 }, (_, i) => `Set ${i + 1},,T,1,mg/m3,60,`);
    const msg = refused(() => readLimitSetsCsv(csv(...rows)));
    expect(msg).toMatch(/Row 2002, column set_name: more than 2,000 sets in one file/);
    // 2,000 sets are fine.
    expect(readLimitSetsCsv(csv(...rows.slice(0, 2000)))).toHaveLength(2000);
  });

  it("file over 5 MB", () => {
    const row = `G,17,T,5,ppm,60,${"x".repeat(900)}`;
    const big = csv(...Array.from({ length: 6000 }, () => row));
    expect(big.length).toBeGreaterThan(5 * 1024 * 1024);
    expect(refused(() => readLimitSetsCsv(big))).toMatch(
      /the file is 5\.\d MB; a limit sets file may be at most 5 MB/,
    );
    expect(refused(() => readLimitSetsFile("big.csv", "", 6 * 1024 * 1024))).toMatch(/6\.0 MB/);
  });

  it("an unclosed quote", () => {
    const msg = refused(() => readLimitSetsCsv(csv('G,17,"T,5,ppm,60,n')));
    expect(msg).toMatch(/Row 2, column 3: a quoted field is not closed/);
  });

  it("one set with two different molecular weights", () => {
    const msg = refused(() => readLimitSetsCsv(csv("G,17,T1,5,ppm,60,n", "G,18,T2,5,ppm,60,n")));
    expect(msg).toMatch(/Row 3, column molecular_weight_g_mol: '18' differs from '17' on row 2/);
  });

  it("lists every problem of the file at once", () => {
    const msg = refused(() => readLimitSetsCsv(csv("G,17,T1,x,ppm,60,n", "G,17,T2,5,ppb,60,n")));
    expect(msg).toMatch(/Row 2, column value/);
    expect(msg).toMatch(/Row 3, column unit/);
  });

  describe("JSON", () => {
    const file = (sets: unknown) =>
      JSON.stringify({ format: "driftmark-limit-sets", version: 1, sets });
    it("not JSON", () => {
      expect(refused(() => readLimitSetsJson("{"))).toMatch(/not valid JSON/);
    });
    it("another format", () => {
      expect(refused(() => readLimitSetsJson('{"format":"x"}'))).toMatch(/format: the file is not/);
    });
    it("__proto__ key", () => {
      expect(
        refused(() => readLimitSetsJson('{"format":"driftmark-limit-sets","__proto__":{"x":1}}')),
      ).toMatch(/"__proto__" is not allowed/);
    });
    it("value not a positive number, named by field path", () => {
      const msg = refused(() =>
        readLimitSetsJson(
          file([
            {
              name: "G",
              molecular_weight_g_mol: 17,
              source_note: "",
              limits: [{ label: "T", value: "5", unit: "ppm", averaging_min: 60 }],
            },
          ]),
        ),
      );
      expect(msg).toMatch(/sets\[0\]\.limits\[0\]\.value: '5' is not a positive number/);
    });
    it("ppm without molecular weight, duplicate labels, averaging out of range", () => {
      const msg = refused(() =>
        readLimitSetsJson(
          file([
            {
              name: "G",
              molecular_weight_g_mol: null,
              limits: [
                { label: "T", value: 5, unit: "ppm", averaging_min: 60 },
                { label: "T", value: 5, unit: "mg/m3", averaging_min: 60 },
              ],
            },
            { name: "H", limits: [{ label: "T", value: 5, unit: "mg/m3", averaging_min: 2000 }] },
          ]),
        ),
      );
      expect(msg).toMatch(/sets\[0\]\.limits\[0\]\.unit: ppm limit in set 'G'/);
      expect(msg).toMatch(/sets\[0\]\.limits\[1\]\.label: duplicate limit label 'T'/);
      expect(msg).toMatch(/sets\[1\]\.limits\[0\]\.averaging_min: averaging time 2000 min/);
    });
  });
});
