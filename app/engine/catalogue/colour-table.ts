/**
 * The intrinsic colour sequence of dwarf stars used for the estimates: rows B0V to M2V of Table 5 of
 * Pecaut & Mamajek (2013, ApJS 208, 9), in the form maintained by E. Mamajek as "A Modern Mean Dwarf
 * Stellar Color and Effective Temperature Sequence" (version 2024.05.15). Columns kept, as printed:
 * spectral type, Teff (K), BCv (mag), R (solar radii), Mv (mag), B−V, V−Rc, V−Ic, V−Ks, J−H, H−Ks
 * (Johnson UBV, Cousins RcIc, 2MASS JHKs). "NaN" stands for the table's "...".
 *
 * B−V increases monotonically down these rows, so each column is a function of B−V; values between rows
 * are interpolated linearly in B−V. The table is a mean sequence for unreddened dwarfs of about solar
 * metallicity: it knows nothing of luminosity class, metallicity or reddening.
 */

const ROWS = `
B0V     31400   -2.99   7.16  -3.90  -0.301     NaN  -0.355  -0.958  -0.159  -0.067
B0.5V   29000   -2.83   6.48  -3.50  -0.289     NaN  -0.338  -0.913  -0.153  -0.063
B1V     26000   -2.58   5.71  -3.00  -0.278  -0.115  -0.325  -0.874  -0.148  -0.059
B1.5V   24500   -2.44   5.02  -2.60  -0.252  -0.114  -0.281  -0.752  -0.132  -0.047
B2V     20600   -2.03   4.06  -1.80  -0.215  -0.094  -0.230  -0.602  -0.113  -0.032
B2.5V   18500   -1.77   3.89  -1.50  -0.198  -0.087  -0.210  -0.544  -0.105  -0.026
B3V     17000   -1.54   3.61  -1.20  -0.178  -0.080  -0.192  -0.492  -0.098  -0.021
B4V     16400   -1.49   3.46  -1.00  -0.165  -0.074  -0.176  -0.447  -0.092  -0.016
B5V     15700   -1.34   3.36  -0.85  -0.156  -0.070  -0.165  -0.380  -0.084  -0.010
B6V     14500   -1.13   3.27  -0.55  -0.140  -0.062  -0.145  -0.358  -0.081  -0.007
B7V     14000   -1.05   2.94  -0.40  -0.128  -0.058  -0.133  -0.325  -0.077  -0.004
B8V     12300   -0.73   2.86   0.00  -0.109  -0.048  -0.108  -0.254  -0.067   0.003
B9V     10700   -0.42   2.49   0.50  -0.070  -0.028  -0.061  -0.121  -0.050   0.016
B9.5V   10400   -0.36   2.45   0.60  -0.050  -0.017  -0.035  -0.048  -0.044   0.021
A0V      9700   -0.21  2.193   0.99   0.000   0.001   0.004   0.041  -0.032   0.028
A1V      9300   -0.14  2.136   1.16   0.035   0.019   0.044   0.090  -0.025   0.030
A2V      8840   -0.07  2.117   1.35   0.070   0.042   0.091   0.178  -0.012   0.034
A3V      8600   -0.04  1.861   1.70   0.100   0.050   0.108   0.253   0.003   0.035
A4V      8250   -0.02  1.794   1.94   0.140   0.078   0.164   0.353   0.022   0.037
A5V      8100    0.00  1.785   2.01   0.160   0.089   0.186   0.403   0.031   0.038
A6V      7910   0.005  1.775   2.12   0.185   0.094   0.197   0.465   0.043   0.039
A7V      7760    0.01  1.750   2.23   0.210   0.117   0.242   0.528   0.055   0.040
A8V      7590    0.02  1.747   2.32   0.250   0.140   0.288   0.601   0.070   0.042
A9V      7400    0.02  1.747   2.43   0.270   0.143   0.294   0.674   0.086   0.044
F0V      7220    0.01  1.728   2.57   0.295   0.166   0.339   0.734   0.096   0.045
F1V      7020   0.005  1.679   2.76   0.330   0.190   0.385   0.819   0.117   0.047
F2V      6820  -0.005  1.622   2.97   0.370   0.213   0.432   0.925   0.140   0.050
F3V      6750   -0.01  1.578   3.08   0.390   0.222   0.449   0.964   0.148   0.051
F4V      6670  -0.015  1.533   3.20   0.410   0.236   0.476   1.012   0.159   0.052
F5V      6550   -0.02  1.473   3.37   0.440   0.252   0.506   1.079   0.173   0.054
F6V      6350   -0.03  1.359   3.69   0.486   0.276   0.553   1.190   0.199   0.057
F7V      6280  -0.035  1.324   3.80   0.500   0.290   0.579   1.221   0.213   0.060
F8V      6180   -0.04  1.221   4.05   0.530   0.300   0.599   1.290   0.225   0.061
F9V      6050   -0.05  1.167   4.25   0.560   0.312   0.620   1.335   0.236   0.063
F9.5V    5990   -0.06  1.142   4.35   0.580   0.323   0.640   1.403   0.249   0.065
G0V      5930  -0.065  1.100   4.48   0.595   0.341   0.673   1.437   0.262   0.067
G1V      5860  -0.073  1.060   4.62   0.622   0.340   0.672   1.500   0.279   0.070
G2V      5770  -0.085  1.012   4.80   0.650   0.363   0.713   1.564   0.293   0.073
G3V      5720  -0.095  1.002   4.87   0.660   0.368   0.722   1.588   0.299   0.074
G4V      5680   -0.10  0.991   4.93   0.670   0.374   0.733   1.611   0.304   0.075
G5V      5660  -0.105  0.977   4.98   0.680   0.377   0.738   1.635   0.310   0.076
G6V      5600  -0.115  0.949   5.10   0.700   0.388   0.758   1.691   0.324   0.079
G7V      5550  -0.125  0.927   5.20   0.710   0.393   0.766   1.705   0.327   0.080
G8V      5480   -0.14  0.914   5.30   0.730   0.404   0.786   1.768   0.342   0.082
G9V      5380   -0.16  0.853   5.55   0.775   0.423   0.820   1.857   0.364   0.087
K0V      5290  -0.195  0.813   5.78   0.816   0.443   0.853   1.953   0.387   0.091
K1V      5170   -0.23  0.797   5.95   0.857   0.457   0.879    2.06   0.404   0.094
K2V      5100   -0.26  0.783   6.07   0.884   0.482   0.920    2.13   0.427   0.098
K3V      4870  -0.365  0.755   6.53   0.990   0.560   1.030    2.35   0.490   0.110
K4V      4600   -0.52  0.710   6.99   1.090   0.635   1.182    2.70   0.539   0.123
K5V      4440   -0.63  0.701   7.28   1.150   0.685   1.272    2.88   0.568   0.132
K6V      4300   -0.75  0.669   7.64   1.240   0.759   1.420    3.08   0.601   0.148
K7V      4090   -0.93  0.630   8.20   1.340   0.802   1.519    3.35   0.619   0.164
K8V      3990   -1.03  0.615   8.43   1.363   0.843   1.632    3.48   0.626   0.171
K9V      3930   -1.07  0.608   8.56   1.400   0.866   1.699    3.55   0.631   0.180
M0V      3850   -1.15  0.588   8.80   1.420   0.889   1.766    3.65   0.627   0.190
M0.5V    3770   -1.29  0.544   9.20   1.445   0.924   1.886    3.84   0.620   0.208
M1V      3660   -1.42  0.501   9.64   1.485   0.956   2.005    4.00   0.614   0.222
M1.5V    3620   -1.50  0.482   9.85   1.495   0.978   2.089    4.10   0.608   0.227
M2V      3560   -1.62  0.446  10.21   1.505   1.001   2.173    4.23   0.600   0.234
`;

/** One column of the table by row, B0V first. */
export interface ColourTable {
  spectralType: readonly string[];
  teffK: Float64Array;
  bcV: Float64Array;
  radiusRsun: Float64Array;
  absVMag: Float64Array;
  bv: Float64Array;
  vMinusRc: Float64Array;
  vMinusIc: Float64Array;
  vMinusKs: Float64Array;
  jMinusH: Float64Array;
  hMinusKs: Float64Array;
}

function parseTable(text: string): ColourTable {
  const lines = text.trim().split("\n");
  const col = (k: number) => Float64Array.from(lines, (l) => Number(l.trim().split(/\s+/)[k]));
  return {
    spectralType: lines.map((l) => l.trim().split(/\s+/)[0]),
    teffK: col(1),
    bcV: col(2),
    radiusRsun: col(3),
    absVMag: col(4),
    bv: col(5),
    vMinusRc: col(6),
    vMinusIc: col(7),
    vMinusKs: col(8),
    jMinusH: col(9),
    hMinusKs: col(10),
  };
}

/** The dwarf colour sequence, rows B0V … M2V. */
export const DWARF_COLOURS: ColourTable = parseTable(ROWS);

/**
 * Linear interpolation of a column at a B−V colour. Returns NaN outside the rows where the column has
 * values (no extrapolation), and the slope d(column)/d(B−V) of the bracketing pair.
 */
export function interpolateColumn(column: Float64Array, bv: number): { value: number; slope: number } {
  const x = DWARF_COLOURS.bv;
  if (!Number.isFinite(bv)) return { value: Number.NaN, slope: Number.NaN };
  for (let i = 0; i + 1 < x.length; i++) {
    if (bv < x[i] || bv > x[i + 1]) continue;
    const y0 = column[i];
    const y1 = column[i + 1];
    if (Number.isNaN(y0) || Number.isNaN(y1)) continue;
    const slope = (y1 - y0) / (x[i + 1] - x[i]);
    return { value: y0 + slope * (bv - x[i]), slope };
  }
  return { value: Number.NaN, slope: Number.NaN };
}
