declare module '@stdlib/stats-base-dists-t-cdf' {
  export default function cdf(x: number, v: number): number;
}
