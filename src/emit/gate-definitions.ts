// OpenQASM 3 definitions, in terms of stdgates.inc and the builtins, of the canonical gates stdgates.inc lacks; the writer emits them and the front end recognises them.
//
// Each definition has exactly the canonical gate's matrix, global phase included (checked in
// test/emit/gate-definitions.test.ts against src/ir/gates.ts and an independent mathjs computation).
// The writer puts `pragma tledger canonical NAME` before each one; the front end, seeing that pragma
// followed by this very text, reads calls to NAME as the canonical gate again (so a round trip gives
// the same IR), while any other OpenQASM 3 reader simply uses the definition.

/** The pragma text (after `pragma`) that marks one of these definitions. */
export const CANONICAL_PRAGMA = "tledger canonical";

const DEFINITIONS: ReadonlyMap<string, string> = new Map([
  ["sxdg", "gate sxdg a { inv @ sx a; }"],
  ["csx", "gate csx a, b { ctrl @ sx a, b; }"],
  ["c3x", "gate c3x a, b, c, d { ctrl(3) @ x a, b, c, d; }"],
  ["c4x", "gate c4x a, b, c, d, e { ctrl(4) @ x a, b, c, d, e; }"],
  ["c3sqrtx", "gate c3sqrtx a, b, c, d { ctrl(3) @ sx a, b, c, d; }"],
  ["c3sqrtxdg", "gate c3sqrtxdg a, b, c, d { ctrl(3) @ inv @ sx a, b, c, d; }"],
  // exp(-i t/2 Z(x)Z): conjugating rz on the second qubit by cx spreads its Z over both.
  ["rzz", "gate rzz(theta) a, b { cx a, b; rz(theta) b; cx a, b; }"],
  // exp(-i t/2 X(x)X) = (H(x)H) exp(-i t/2 Z(x)Z) (H(x)H).
  ["rxx", "gate rxx(theta) a, b { h a; h b; cx a, b; rz(theta) b; cx a, b; h a; h b; }"],
  // exp(-i t/2 Y(x)Y) = (W(x)W) exp(-i t/2 Z(x)Z) (W(x)W)^dag with W = S H (W Z W^dag = Y).
  ["ryy", "gate ryy(theta) a, b { sdg a; sdg b; h a; h b; cx a, b; rz(theta) b; cx a, b; h a; h b; s a; s b; }"],
  // exp(-i t/2 Z(x)X) = (I(x)H) exp(-i t/2 Z(x)Z) (I(x)H).
  ["rzx", "gate rzx(theta) a, b { h b; cx a, b; rz(theta) b; cx a, b; h b; }"],
  // The relative-phase Toffolis, as networks of h, t, tdg and cx.
  ["rccx", "gate rccx a, b, c { h c; t c; cx b, c; tdg c; cx a, c; t c; cx b, c; tdg c; h c; }"],
  [
    "rc3x",
    "gate rc3x a, b, c, d { h d; t d; cx c, d; tdg d; h d; cx a, d; t d; cx b, d; tdg d; cx a, d; t d; cx b, d; tdg d; h d; t d; cx c, d; tdg d; h d; }",
  ],
  [
    "rc3xdg",
    "gate rc3xdg a, b, c, d { h d; t d; cx c, d; tdg d; h d; t d; cx b, d; tdg d; cx a, d; t d; cx b, d; tdg d; cx a, d; h d; t d; cx c, d; tdg d; h d; }",
  ],
]);

/** The definition text of a canonical gate that stdgates.inc does not define, else null. */
export function gateDefinition(name: string): string | null {
  return DEFINITIONS.get(name) ?? null;
}

/** Every gate with a definition here. */
export function definedGates(): readonly string[] {
  return [...DEFINITIONS.keys()];
}

/** Definition texts compare equal when they differ only in blanks. */
export function sameDefinitionText(a: string, b: string): boolean {
  return a.replace(/\s+/g, "") === b.replace(/\s+/g, "");
}
