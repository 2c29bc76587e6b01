/**
 * Collects parsed rows into fixed-size Float64Array columns and hands each full chunk to a
 * callback. Internal to ingestion: every reader (the fast one, the quoted-field one, records from csv-parse) writes rows
 * into the same assembler, so a file can switch reader mid-way without the consumer noticing.
 * Each delivered chunk owns fresh arrays: the consumer may keep them.
 */
export class ChunkAssembler {
  columns: Float64Array[];
  row = 0;
  /** Samples delivered before the current chunk. */
  delivered = 0;

  constructor(
    readonly width: number,
    readonly capacity: number,
    private readonly deliver: (columns: Float64Array[], firstSample: number) => void,
  ) {
    this.columns = this.fresh();
  }

  private fresh(): Float64Array[] {
    const out: Float64Array[] = [];
    for (let k = 0; k < this.width; k++) out.push(new Float64Array(this.capacity));
    return out;
  }

  /** Delivers the rows collected so far (if any) and starts a new chunk. */
  flush(): void {
    if (this.row === 0) return;
    const cols = this.row === this.capacity ? this.columns : this.columns.map((c) => c.subarray(0, this.row));
    const first = this.delivered;
    this.delivered += this.row;
    this.row = 0;
    this.columns = this.fresh();
    this.deliver(cols, first);
  }

  /** Samples collected so far, delivered or not. */
  get samples(): number {
    return this.delivered + this.row;
  }
}
