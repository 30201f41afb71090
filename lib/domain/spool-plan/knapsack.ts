// Exact bounded knapsack by dynamic programming over integer lengths: the pricing step of column generation
// and the "most a spool can hold" fill used by the cover bound.

export interface KnapsackItem {
  /** Item index in the caller's numbering. */
  item: number;
  /** Integer weight (length in the caller's length unit). */
  weight: number;
  value: number;
  /** Most copies allowed. */
  bound: number;
}

/**
 * One DP table for every capacity up to `maxCapacity`: value(w) is the best total value of copies with total
 * weight ≤ w, pattern(w) a pattern reaching it. Bounded copies are split into 1, 2, 4, … pieces (binary
 * splitting), which keeps the DP 0-1 and the counts within their bounds.
 */
export class KnapsackTable {
  readonly maxCapacity: number;
  private readonly dp: Float64Array;
  private readonly bits: Uint32Array;
  private readonly words: number;
  private readonly pieceItem: number[] = [];
  private readonly pieceWeight: number[] = [];
  private readonly pieceCount: number[] = [];

  constructor(items: readonly KnapsackItem[], maxCapacity: number) {
    const cap = Math.max(0, Math.floor(maxCapacity));
    this.maxCapacity = cap;
    for (const it of items) {
      if (it.value <= 0 || it.weight <= 0 || it.weight > cap || it.bound <= 0) continue;
      let left = Math.min(it.bound, Math.floor(cap / it.weight));
      for (let piece = 1; left > 0; piece *= 2) {
        const k = Math.min(piece, left);
        left -= k;
        this.pieceItem.push(it.item);
        this.pieceWeight.push(it.weight * k);
        this.pieceCount.push(k);
      }
    }
    const values = new Map<number, number>();
    for (const it of items) values.set(it.item, it.value);
    this.words = (cap >>> 5) + 1;
    this.dp = new Float64Array(cap + 1);
    this.bits = new Uint32Array(this.words * this.pieceItem.length);
    const dp = this.dp;
    const bits = this.bits;
    for (let j = 0; j < this.pieceItem.length; j++) {
      const wj = this.pieceWeight[j]!;
      const vj = values.get(this.pieceItem[j]!)! * this.pieceCount[j]!;
      const base = j * this.words;
      for (let w = cap; w >= wj; w--) {
        const cand = dp[w - wj]! + vj;
        if (cand > dp[w]!) {
          dp[w] = cand;
          bits[base + (w >>> 5)]! |= 1 << (w & 31);
        }
      }
    }
  }

  value(capacity: number): number {
    return this.dp[Math.min(this.maxCapacity, Math.floor(capacity))]!;
  }

  /** Item counts of an optimal pattern for this capacity, as parallel arrays sorted by item index. */
  pattern(capacity: number): { items: number[]; counts: number[] } {
    let w = Math.min(this.maxCapacity, Math.floor(capacity));
    const counts = new Map<number, number>();
    for (let j = this.pieceItem.length - 1; j >= 0; j--) {
      if ((this.bits[j * this.words + (w >>> 5)]! >>> (w & 31)) & 1) {
        const i = this.pieceItem[j]!;
        counts.set(i, (counts.get(i) ?? 0) + this.pieceCount[j]!);
        w -= this.pieceWeight[j]!;
      }
    }
    const items = [...counts.keys()].sort((a, b) => a - b);
    return { items, counts: items.map((i) => counts.get(i)!) };
  }
}
