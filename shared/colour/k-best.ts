/** Keeps the k best (ΔE00, position) pairs sorted, ties broken by list position (lower first). */
export class KBest {
  readonly deltaE: number[] = [];
  readonly index: number[] = [];
  constructor(private readonly k: number) {}

  get full(): boolean {
    return this.deltaE.length === this.k;
  }
  get worst(): number {
    return this.full ? this.deltaE[this.k - 1] : Infinity;
  }
  offer(deltaE: number, index: number): void {
    const last = this.deltaE.length - 1;
    if (this.full && (deltaE > this.deltaE[last] || (deltaE === this.deltaE[last] && index > this.index[last]))) return;
    let p = this.full ? last : last + 1;
    while (p > 0 && (this.deltaE[p - 1] > deltaE || (this.deltaE[p - 1] === deltaE && this.index[p - 1] > index))) {
      this.deltaE[p] = this.deltaE[p - 1];
      this.index[p] = this.index[p - 1];
      p--;
    }
    this.deltaE[p] = deltaE;
    this.index[p] = index;
  }
}
