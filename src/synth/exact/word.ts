// One-qubit Clifford+T gate words in circuit order: T-count, exact matrix, inverse, exact-matrix-preserving simplification.
import { type ExactU2, U2_IDENTITY, u2ApplyGate } from "./matrix.js";

/** The one-qubit gates of a Clifford+T word (OpenQASM 3 standard gate names). */
export type Gate1 = "h" | "s" | "sdg" | "t" | "tdg" | "x" | "y" | "z";

/**
 * A word in circuit order: the first gate is applied first, so the word's matrix is the product of the
 * gate matrices in reverse order (word [g1, g2, g3] has matrix G3 · G2 · G1).
 */
export type Word = readonly Gate1[];

export const GATES1: readonly Gate1[] = ["h", "s", "sdg", "t", "tdg", "x", "y", "z"];

const INVERSE: Readonly<Record<Gate1, Gate1>> = { h: "h", s: "sdg", sdg: "s", t: "tdg", tdg: "t", x: "x", y: "y", z: "z" };

/** The number of T and T† gates. */
export function tCount(word: Word): number {
  let n = 0;
  for (const g of word) if (g === "t" || g === "tdg") n++;
  return n;
}

/** The exact matrix of the word (global phase included): G_last · ... · G_first. */
export function wordMatrix(word: Word): ExactU2 {
  let m = U2_IDENTITY;
  for (const g of word) m = u2ApplyGate(g, m);
  return m;
}

/** The inverse word (reversed, each gate inverted); its matrix is the adjoint, exactly. */
export function inverseWord(word: Word): Word {
  const out: Gate1[] = new Array(word.length);
  for (let i = 0; i < word.length; i++) out[word.length - 1 - i] = INVERSE[word[i]!];
  return out;
}

/** Space-separated gate names in circuit order, e.g. "h t s"; the empty word gives "". */
export function wordToString(word: Word): string {
  return word.join(" ");
}

/** The inverse of wordToString: gate names separated by spaces (or commas); throws on an unknown name. */
export function parseWord(text: string): Word {
  const out: Gate1[] = [];
  for (const tok of text.split(/[\s,]+/)) {
    if (tok === "") continue;
    if (!(GATES1 as readonly string[]).includes(tok)) throw new RangeError(`parseWord: unknown gate "${tok}"`);
    out.push(tok as Gate1);
  }
  return out;
}

// ---- simplification ------------------------------------------------------------------------------

/** T^m (exact, no phase: S = T², Z = T⁴, T⁸ = I) written with the fewest gates and at most one T. */
const DIAG_WORD: readonly (readonly Gate1[])[] = [[], ["t"], ["s"], ["s", "t"], ["z"], ["z", "t"], ["sdg"], ["tdg"]];

/** Stack items: a merged diagonal run T^m is the number m in 1..7; h, x, y are coded as 8, 9, 10. */
const H_ITEM = 8;
const X_ITEM = 9;
const Y_ITEM = 10;
const ITEM_CODE: Readonly<Record<Gate1, number>> = { t: 1, s: 2, z: 4, sdg: 6, tdg: 7, h: H_ITEM, x: X_ITEM, y: Y_ITEM };
const ITEM_GATE: readonly Gate1[] = ["h", "x", "y"];

/**
 * Simplify a word without changing its exact matrix (global phase included) and without increasing its
 * length or T-count. Rules, applied to a fixpoint in one left-to-right pass with a stack:
 * runs of diagonal gates (t, tdg, s, sdg, z, all commuting powers of T) merge to T^m with m mod 8;
 * h h, x x, y y cancel; h z h -> x and h x h -> z.
 */
export function simplifyWord(word: Word): Word {
  const st: number[] = [];
  for (const g of word) {
    let it = ITEM_CODE[g];
    // push `it`, letting each rewrite produce a new item to push in turn
    for (;;) {
      const n = st.length;
      const top = n > 0 ? st[n - 1]! : -1;
      if (it < 8) {
        if (top >= 0 && top < 8) {
          st.pop();
          const m = (top + it) % 8;
          if (m === 0) break;
          it = m;
          continue;
        }
        st.push(it);
        break;
      }
      if (top === it) {
        st.pop();
        break;
      }
      if (it === H_ITEM && n >= 2 && st[n - 2] === H_ITEM && (top === 4 || top === X_ITEM)) {
        st.length = n - 2;
        it = top === 4 ? X_ITEM : 4; // h z h = x, h x h = z
        continue;
      }
      st.push(it);
      break;
    }
  }
  const out: Gate1[] = [];
  for (const it of st) {
    if (it < 8) for (const g of DIAG_WORD[it]!) out.push(g);
    else out.push(ITEM_GATE[it - 8]!);
  }
  return out;
}
