// The diff's public face: compare two compiled outputs, check limits on their growth, test equivalence, and write the result.
export { diffSides, metricChange, isMetricName, METRIC_NAMES, COUNT_METRICS, DECIMAL_METRICS } from "./compare.js";
export type { DiffSide, DiffResult, MetricChange, CountChange, DecimalChange, MetricName, GateChange, QubitChange, SideInfo, SideSource } from "./compare.js";
export { pairLedgers, type LedgerDiff, type RowPair, type RowField } from "./ledger-pairs.js";
export { parseThresholds, checkThresholds, type Limit, type Violation } from "./thresholds.js";
export { equivalence, BASE_TOLERANCE, PER_GATE_TOLERANCE, type Equivalence, type EquivalenceOptions } from "./equiv.js";
export { diffText, diffMarkdown, diffJson, metricLabel, violationText, equivalenceText, DIFF_SCHEMA_VERSION, type DiffChecks, type DiffTextOptions } from "./format.js";
