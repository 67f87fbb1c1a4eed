// The single-qubit Clifford group: its 24 elements up to phase (192 with the phases ω^j), shortest words, exact lookup and products.
import { type ExactU2, U2_IDENTITY, u2ApplyGate, u2Key, u2Mul, u2MulOmega } from "./matrix.js";
import type { Gate1, Word } from "./word.js";

/** One Clifford up to phase, represented by the exact matrix of its shortest H/S word (so its phase is fixed by that word). */
export interface CliffordElement {
  /** Position in CLIFFORDS; 0 is the identity. */
  readonly index: number;
  /** matrix = wordMatrix(hsWord), exactly. */
  readonly matrix: ExactU2;
  /** A shortest word over {h, s} (circuit order) for this Clifford up to phase; found first by breadth-first search. */
  readonly hsWord: Word;
  /** A shortest word over {h, s, sdg, x, y, z} equal to `matrix` up to a power of ω (fewer gates to emit). */
  readonly word: Word;
  /** The j in 0..7 with matrix = ω^j · wordMatrix(word). */
  readonly wordPhase: number;
}

/** The number of single-qubit Cliffords with phases ω^j (24 up to phase times 8 phases). */
export const CLIFFORD_COUNT_WITH_PHASE = 192;

/** Key of x up to a global power of ω: the least of the 8 keys. */
function phaseFreeKey(x: ExactU2): string {
  let best = u2Key(x);
  for (let j = 1; j < 8; j++) {
    const k = u2Key(u2MulOmega(x, j));
    if (k < best) best = k;
  }
  return best;
}

/** Breadth-first search from the identity over the given generators, up to phase. Returns words in discovery order. */
function bfsWords(gens: readonly Gate1[]): { words: Word[]; keys: string[]; mats: ExactU2[] } {
  const seen = new Map<string, number>();
  const words: Word[] = [[]];
  const mats: ExactU2[] = [U2_IDENTITY];
  const keys: string[] = [phaseFreeKey(U2_IDENTITY)];
  seen.set(keys[0]!, 0);
  for (let i = 0; i < words.length; i++) {
    for (const g of gens) {
      const m = u2ApplyGate(g, mats[i]!);
      const key = phaseFreeKey(m);
      if (seen.has(key)) continue;
      seen.set(key, words.length);
      words.push([...words[i]!, g]);
      mats.push(m);
      keys.push(key);
    }
  }
  return { words, keys, mats };
}

function buildTable(): { elements: CliffordElement[]; lookup: Map<string, { index: number; phase: number }> } {
  const hs = bfsWords(["h", "s"]);
  if (hs.words.length !== 24) throw new Error(`internal: H and S generate ${hs.words.length} Cliffords up to phase, expected 24`);
  const ext = bfsWords(["h", "s", "sdg", "x", "y", "z"]);
  const extByKey = new Map<string, number>();
  ext.keys.forEach((k, i) => extByKey.set(k, i));
  const elements: CliffordElement[] = [];
  const lookup = new Map<string, { index: number; phase: number }>();
  for (let i = 0; i < 24; i++) {
    const matrix = hs.mats[i]!;
    const e = extByKey.get(hs.keys[i]!);
    if (e === undefined) throw new Error("internal: Clifford missing from the extended search");
    const em = ext.mats[e]!;
    let wordPhase = -1;
    for (let j = 0; j < 8; j++) if (u2Key(u2MulOmega(em, j)) === u2Key(matrix)) wordPhase = j;
    if (wordPhase < 0) throw new Error("internal: Clifford words differ by more than a phase");
    elements.push({ index: i, matrix, hsWord: hs.words[i]!, word: ext.words[e]!, wordPhase });
    for (let j = 0; j < 8; j++) lookup.set(u2Key(u2MulOmega(matrix, j)), { index: i, phase: j });
  }
  if (lookup.size !== CLIFFORD_COUNT_WITH_PHASE) throw new Error("internal: Cliffords with phase are not 192 distinct matrices");
  return { elements, lookup };
}

const TABLE = buildTable();

/** The 24 Cliffords up to phase, identity first, in breadth-first order of their H/S words. */
export const CLIFFORDS: readonly CliffordElement[] = TABLE.elements;

/** If u is a Clifford with phase, the index i and the j in 0..7 with u = ω^j · CLIFFORDS[i].matrix; else null. */
export function cliffordLookup(u: ExactU2): { readonly index: number; readonly phase: number } | null {
  if (u.k > 1) return null; // every Clifford has least denominator exponent 0 or 1
  return TABLE.lookup.get(u2Key(u)) ?? null;
}

const PRODUCTS: readonly { readonly index: number; readonly phase: number }[] = (() => {
  const out: { index: number; phase: number }[] = [];
  for (const x of CLIFFORDS)
    for (const y of CLIFFORDS) {
      const r = cliffordLookup(u2Mul(x.matrix, y.matrix));
      if (r === null) throw new Error("internal: the Cliffords are not closed under products");
      out.push(r);
    }
  return out;
})();

/** The matrix product of CLIFFORDS[i] and CLIFFORDS[j]: the index m and phase p with C_i · C_j = ω^p · C_m. */
export function cliffordProduct(i: number, j: number): { readonly index: number; readonly phase: number } {
  return PRODUCTS[i * 24 + j]!;
}
