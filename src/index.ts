// The public library API: what the command line itself uses, for programs that embed tledger.
export type { Angle, Rational } from "./ir/angle.js";
export type { Circuit, Stmt, GateOp, SourceLoc, QubitReg, ClassicalReg, BitRef, CondExpr } from "./ir/circuit.js";
export { DiagnosticError, type Diagnostic, type Severity } from "./frontend/diagnostics.js";
export { parseQasmFile, parseQasmText, type FrontendOptions } from "./frontend/frontend.js";
export { writeQasm3, formatAngle, type WriteOptions } from "./emit/qasm3.js";
export { summarizeCircuit, formatSummary, type CircuitSummary } from "./cli/summary.js";
export { formatDiagnostic, runCommand, writeFileAtomic, writeOutput, parseParams, type Io, type RunOptions } from "./cli/common.js";
export { buildProgram } from "./cli/program.js";
