// Rates shown in a provider's trust section, each with the counts it comes from so the page can
// say "9 of 10" rather than a bare percentage.

function assertCount(name: string, value: number): void {
  if (!Number.isInteger(value) || value < 0) {
    throw new RangeError(`${name} must be a whole number ≥ 0, got ${value}`);
  }
}

export type CountedRate = {
  /** null when the denominator is 0: there is nothing to measure yet. */
  readonly rate: number | null;
  readonly count: number;
  readonly outOf: number;
};

/**
 * Share of accepted jobs that were completed. `jobsAccepted` counts accepted jobs whose outcome
 * is settled (completed, cancelled or abandoned), not those still under way, so a busy provider
 * is not marked down for work in progress.
 */
export function completionRate(jobsCompleted: number, jobsAccepted: number): CountedRate {
  assertCount("jobsCompleted", jobsCompleted);
  assertCount("jobsAccepted", jobsAccepted);
  if (jobsCompleted > jobsAccepted) {
    throw new RangeError(`jobsCompleted (${jobsCompleted}) cannot exceed jobsAccepted (${jobsAccepted})`);
  }
  return { rate: jobsAccepted === 0 ? null : jobsCompleted / jobsAccepted, count: jobsCompleted, outOf: jobsAccepted };
}

/** Share of accepted jobs that ended in a dispute the provider lost. */
export function disputeRate(disputesLost: number, jobsAccepted: number): CountedRate {
  assertCount("disputesLost", disputesLost);
  assertCount("jobsAccepted", jobsAccepted);
  if (disputesLost > jobsAccepted) {
    throw new RangeError(`disputesLost (${disputesLost}) cannot exceed jobsAccepted (${jobsAccepted})`);
  }
  return { rate: jobsAccepted === 0 ? null : disputesLost / jobsAccepted, count: disputesLost, outOf: jobsAccepted };
}

/** One farmer's report a week after hand-over. */
export type SurvivalReport = { readonly fishHandedOver: number; readonly fishSurvived: number };

export type SurvivalSummary = {
  /** Mean of the reports' survival shares (each farmer counts once); null with no reports. */
  readonly mean: number | null;
  /** Number of reports the mean is taken over: the sample size to show beside it. */
  readonly count: number;
  readonly fishHandedOver: number;
  readonly fishSurvived: number;
};

/**
 * Mean 7-day survival over the reports. Each report weighs the same, whatever its batch size,
 * so one large order cannot drown out the experience of many small farmers.
 */
export function survivalMean(reports: readonly SurvivalReport[]): SurvivalSummary {
  let shares = 0;
  let handedOver = 0;
  let survived = 0;
  for (const report of reports) {
    assertCount("fishHandedOver", report.fishHandedOver);
    assertCount("fishSurvived", report.fishSurvived);
    if (report.fishHandedOver === 0) throw new RangeError("a survival report needs at least one fish handed over");
    if (report.fishSurvived > report.fishHandedOver) {
      throw new RangeError(
        `fishSurvived (${report.fishSurvived}) cannot exceed fishHandedOver (${report.fishHandedOver})`,
      );
    }
    shares += report.fishSurvived / report.fishHandedOver;
    handedOver += report.fishHandedOver;
    survived += report.fishSurvived;
  }
  return {
    mean: reports.length === 0 ? null : shares / reports.length,
    count: reports.length,
    fishHandedOver: handedOver,
    fishSurvived: survived,
  };
}
