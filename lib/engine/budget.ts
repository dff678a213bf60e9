/**
 * A run's work budget: wall-clock time and integrator steps. Routines that may run long
 * check it and give up with BudgetExceeded; the claims they served become `inconclusive`
 * with "budget exceeded" instead of the run hanging.
 */
export class BudgetExceeded extends Error {
  constructor(
    readonly resource: "time" | "steps",
    readonly limit: number,
  ) {
    super(
      resource === "time"
        ? `budget exceeded: the run took longer than ${limit / 1000} s of computing time`
        : `budget exceeded: more than ${limit} integrator steps`,
    );
    this.name = "BudgetExceeded";
  }
}

export interface BudgetLimits {
  /** Wall-clock milliseconds for the whole run (default 10 000). */
  wallClockMs?: number;
  /** Integrator steps summed over every integration of the run (default 2 000 000). */
  maxSteps?: number;
}

export class Budget {
  readonly wallClockMs: number;
  readonly maxSteps: number;
  private readonly startedAt: number;
  private steps = 0;

  constructor(limits: BudgetLimits = {}, private readonly now: () => number = () => performance.now()) {
    this.wallClockMs = limits.wallClockMs ?? 10_000;
    this.maxSteps = limits.maxSteps ?? 2_000_000;
    this.startedAt = now();
  }

  elapsedMs(): number {
    return this.now() - this.startedAt;
  }

  /** Throws BudgetExceeded when the wall clock has run out. */
  checkTime(): void {
    if (this.elapsedMs() > this.wallClockMs) throw new BudgetExceeded("time", this.wallClockMs);
  }

  /** Counts integrator steps; throws BudgetExceeded past the limit or the wall clock. */
  chargeSteps(n: number): void {
    this.steps += n;
    if (this.steps > this.maxSteps) throw new BudgetExceeded("steps", this.maxSteps);
    this.checkTime();
  }

  stepsUsed(): number {
    return this.steps;
  }
}
