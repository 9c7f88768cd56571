/**
 * Every tuning constant of the nester, in one place. Work is counted, not
 * timed, so that a layout is the same on every machine and every run: the
 * heuristics count part visits, the exact search counts its own steps.
 */
export const NESTING_TUNING = {
  /** part visits allowed per `nest` call at quick */
  workLimit: { quick: 30_000 },
  /**
   * Part visits allowed per `nest` call at thorough: `perSheet` times the job's size in sheets (the parts'
   * area over the usable sheet's), kept within [min, max]; `max` bounds the hardest instances to about
   * 1.3 s here, under the 2 s target.
   */
  thoroughWork: { perSheet: 100_000, min: 300_000, max: 2_400_000 },
  /** thorough rounds stop after this many rounds in a row that save no sheet */
  staleRounds: 2,
  /** the seed of the nester's random choices when the caller gives none */
  defaultSeed: 20261201,
  /** a part visit of the heuristics costs about as much time as this many steps of the exact search */
  stepsPerVisit: 120,
  /**
   * The exact search runs when the layout stands one sheet over the bound. With under this share of the
   * bound's sheets left over (nearly full sheets, which greedy fills rarely close) it runs early, after the
   * first round of greedy fills, with `exactEarlyShare` of the work limit; otherwise after the greedy fills,
   * with what is left of `exactLateShare` of it.
   */
  tightLeftover: 0.02,
  exactEarlyShare: 0.7,
  exactLateShare: 0.5,
  /** moves allowed when emptying the least-filled sheet after the greedy fills */
  emptyingMoves: { quick: 60, thorough: 4000 },
  /** thorough rounds of best-of-trials fills: each count is `work / parts`, kept within [min, max] */
  roundTrials: { work: 6000, min: 2, max: 12 },
  rounds: { work: 20_000, min: 2, max: 8 },
  /** moves allowed when emptying a sheet after each thorough round: this over the part count */
  roundEmptyingMoves: 200_000,
  /** random orders tried per move when one sheet over the bound */
  oneOverRetries: 10,
  /** the spread of the random part orders: a part's area is weighed by 1 +- this */
  trialOrderNoise: 0.35,
  retryOrderNoise: 0.6,
  /** space-first fills with noise: how often a smaller part is taken instead, and among how many */
  spaceNoiseChance: 0.3,
  spaceNoiseChoices: 3,
  /** the exact search (exact.ts) */
  exact: {
    /** failed states remembered at most */
    memoCap: 2_000_000,
    /** steps counted per node of the search, before the per-rectangle work */
    stepsPerNode: 250,
    /** the first run's budget is this many steps per kind of part (at least `minKinds` kinds) */
    firstRunStepsPerKind: 8000,
    minKinds: 8,
    /** each restart's budget grows by this factor */
    budgetGrowth: 1.1,
    /** on a restart a kind's weight for the order is its area times 1 +- this */
    restartShake: 1,
    /** the row and column bounds need whole-number sizes up to this (sheet side plus kerf) */
    maxBoundSize: 1024,
  },
} as const;
