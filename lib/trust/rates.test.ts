import { describe, expect, it } from "vitest";
import { completionRate, disputeRate, survivalMean } from "./rates";

// These are definitions (a count over a count); the checks pin down which counts are used.
describe("completion and dispute rates", () => {
  it("completion rate is completed over accepted, with its counts", () => {
    expect(completionRate(9, 12)).toEqual({ rate: 0.75, count: 9, outOf: 12 });
  });

  it("has no rate before any accepted job has ended", () => {
    expect(completionRate(0, 0).rate).toBeNull();
    expect(disputeRate(0, 0).rate).toBeNull();
  });

  it("dispute rate is disputes lost over accepted jobs", () => {
    expect(disputeRate(1, 20)).toEqual({ rate: 0.05, count: 1, outOf: 20 });
  });

  it("refuses counts that cannot happen", () => {
    expect(() => completionRate(5, 4)).toThrow(RangeError);
    expect(() => disputeRate(3, 2)).toThrow(RangeError);
    expect(() => completionRate(-1, 4)).toThrow(RangeError);
  });
});

describe("survivalMean", () => {
  it("averages the reports' shares, each farmer counting once", () => {
    // 180 of 200 (90 %) and 50 of 50 (100 %): mean of shares 95 %, whereas pooling the fish
    // would give 230/250 = 92 %.
    const summary = survivalMean([
      { fishHandedOver: 200, fishSurvived: 180 },
      { fishHandedOver: 50, fishSurvived: 50 },
    ]);
    expect(summary.mean).toBeCloseTo(0.95, 12);
    expect(summary.count).toBe(2);
    expect(summary.fishHandedOver).toBe(250);
    expect(summary.fishSurvived).toBe(230);
  });

  it("has no mean without reports", () => {
    expect(survivalMean([])).toEqual({ mean: null, count: 0, fishHandedOver: 0, fishSurvived: 0 });
  });

  it("refuses a report with more survivors than fish, or no fish", () => {
    expect(() => survivalMean([{ fishHandedOver: 10, fishSurvived: 11 }])).toThrow(RangeError);
    expect(() => survivalMean([{ fishHandedOver: 0, fishSurvived: 0 }])).toThrow(RangeError);
  });
});
