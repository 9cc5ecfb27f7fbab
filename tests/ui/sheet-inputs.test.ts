import { describe, expect, it } from "vitest";
import demo from "../../examples/demo.json" with { type: "json" };
import { estimate } from "../../src/core/index.ts";
import type { Scenario } from "../../src/core/types.ts";
import { inputRows, placeRows } from "../../src/ui/sheet/inputs.ts";

const scenario = demo as unknown as Scenario;

describe("the estimate sheet's inputs and places", () => {
  it("lists every input of the scenario, each limit and the limit set with its source", () => {
    const rows = inputRows(
      { ...scenario, limit_set: { name: "Gas Q (invented)", source_note: "Invented list" } },
      "metric",
    );
    const get = (label: string) => rows.find((r) => r.label === label)?.value;
    expect(get("Release")).toBe("continuous");
    expect(get("Release rate")).toBe("0.5 kg/s");
    expect(get("Duration")).toBe("15 min");
    expect(get("Wind speed")).toBe("3 m/s");
    expect(get("Wind from")).toBe("250° (WSW)");
    expect(get("Stability class")).toBe("D");
    expect(get("Molecular weight")).toBe("34.1 g/mol");
    expect(get("Limit 1")).toBe("Limit A (invented) 60 min: 3 ppm, 60 min");
    expect(get("Limit 3")).toBe("Limit C (invented) 10 min: 100 ppm, 10 min");
    expect(get("Wind swing")).toBe("±10°");
    expect(get("Source location")).toBe("47.00000, 8.00000");
    expect(get("Limit set")).toBe("Gas Q (invented)");
    expect(get("Limit set source")).toBe("Invented list");
    // Labels are unique: each row is one input.
    expect(new Set(rows.map((r) => r.label)).size).toBe(rows.length);
  });

  it("says for each place which limits it is above and when", () => {
    const out = estimate(scenario);
    const rows = placeRows(out.points, "metric");
    expect(rows).toHaveLength(scenario.points?.length ?? 0);
    out.points.forEach((p, i) => {
      const above = p.limits.filter((l) => l.arrives_s !== null).length;
      const text = rows[i]?.value ?? "";
      expect(text.split("above ").length - 1).toBe(above);
      if (above === 0) expect(text).toContain("below every limit");
    });
    expect(rows[0]?.label).toBe("Place 1: 1 km downwind");
    const named = placeRows([{ ...out.points[0], name: "School (invented)" } as never], "metric");
    expect(named[0]?.label).toBe("School (invented): 1 km downwind");
  });
});
