/**
 * Bessel functions J0, J1, J2 of real argument, for the Sommerfeld integrals along the real axis.
 * Polynomial approximations of Abramowitz & Stegun, Handbook of Mathematical Functions, §9.4.1–9.4.6
 * (absolute error below 1e-7), which is far below the accuracy the tabulated ground kernel needs.
 */

export function besselJ0(x: number): number {
  const ax = Math.abs(x);
  if (ax <= 3) {
    const y = (x / 3) * (x / 3);
    return (
      1 +
      y * (-2.2499997 + y * (1.2656208 + y * (-0.3163866 + y * (0.0444479 + y * (-0.0039444 + y * 0.00021)))))
    );
  }
  const y = 3 / ax;
  const f0 =
    0.79788456 +
    y *
      (-0.00000077 +
        y * (-0.0055274 + y * (-0.00009512 + y * (0.00137237 + y * (-0.00072805 + y * 0.00014476)))));
  const t0 =
    ax -
    0.78539816 +
    y *
      (-0.04166397 +
        y * (-0.00003954 + y * (0.00262573 + y * (-0.00054125 + y * (-0.00029333 + y * 0.00013558)))));
  return (f0 * Math.cos(t0)) / Math.sqrt(ax);
}

export function besselJ1(x: number): number {
  const ax = Math.abs(x);
  if (ax <= 3) {
    const y = (x / 3) * (x / 3);
    return (
      x *
      (0.5 +
        y *
          (-0.56249985 +
            y * (0.21093573 + y * (-0.03954289 + y * (0.00443319 + y * (-0.00031761 + y * 0.00001109))))))
    );
  }
  const y = 3 / ax;
  const f1 =
    0.79788456 +
    y *
      (0.00000156 +
        y * (0.01659667 + y * (0.00017105 + y * (-0.00249511 + y * (0.00113653 + y * -0.00020033)))));
  const t1 =
    ax -
    2.35619449 +
    y *
      (0.12499612 +
        y * (0.0000565 + y * (-0.00637879 + y * (0.00074348 + y * (0.00079824 + y * -0.00029166)))));
  const v = (f1 * Math.cos(t1)) / Math.sqrt(ax);
  return x < 0 ? -v : v;
}

/** J2 by the recurrence 2J1/x − J0, and by its power series where that recurrence cancels (|x| < 2). */
export function besselJ2(x: number): number {
  const ax = Math.abs(x);
  if (ax < 2) {
    // Σ (−1)^m (x/2)^{2m+2} / (m! (m+2)!)
    const h2 = (x * x) / 4;
    let term = h2 / 2;
    let sum = term;
    for (let m = 1; m < 12; m++) {
      term *= -h2 / (m * (m + 2));
      sum += term;
    }
    return sum;
  }
  return (2 * besselJ1(x)) / x - besselJ0(x);
}
