// What a circuit pass may receive besides the circuit: a place for warnings and a few switches (kept small; extended as passes need).
import type { Diagnostic } from "../frontend/diagnostics.js";

export interface PassContext {
  /** Where a pass appends warnings (errors are thrown as DiagnosticError). */
  readonly diagnostics?: Diagnostic[];
  /**
   * Let the decompose pass borrow other qubits of the circuit as dirty ancillas for multi-controlled
   * gates (each borrowed qubit is returned exactly to its state, whatever it was). This turns
   * multi-controlled X into exact Toffoli networks; off by default, so every decomposition stays on
   * the qubits of its own operation.
   */
  readonly borrowIdleQubits?: boolean;
}
