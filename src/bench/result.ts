/** One benchmark figure. */
export interface BenchResult {
  readonly name: string;
  readonly value: number;
  readonly unit: string;
  readonly detail: string;
}
