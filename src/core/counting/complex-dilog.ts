const PI2_6 = (Math.PI * Math.PI) / 6;

/** B_{2j}/(2j (2j + 1)!) for j = 1..12: the odd coefficients of Li₂(e^{−u}) at u = 0. */
const BERNOULLI_2J = [
  1 / 6, -1 / 30, 1 / 42, -1 / 30, 5 / 66, -691 / 2730, 7 / 6, -3617 / 510, 43867 / 798, -174611 / 330, 854513 / 138, -236364091 / 2730,
];
export const LI2_ODD = BERNOULLI_2J.map((B, i) => {
  const j = i + 1;
  let f = 1;
  for (let k = 2; k <= 2 * j + 1; k++) f *= k;
  return B / (2 * j * f);
});

/** Li₂(e^{−u}) for complex u with Re u > 0 (|u| < 2π when Re u < 1). */
export function complexLi2ExpNeg(ur: number, ui: number): [number, number] {
  if (ur >= 1) {
    // Σ_j e^{−ju}/j²
    const er = Math.exp(-ur) * Math.cos(ui);
    const ei = -Math.exp(-ur) * Math.sin(ui);
    let pr = er;
    let pi = ei;
    let sr = 0;
    let si = 0;
    const mod = Math.exp(-ur);
    let pm = mod;
    for (let j = 1; j < 60 && pm > 1e-18 * j * j; j++) {
      sr += pr / (j * j);
      si += pi / (j * j);
      const nr = pr * er - pi * ei;
      pi = pr * ei + pi * er;
      pr = nr;
      pm *= mod;
    }
    return [sr, si];
  }
  // π²/6 − u + u log u − u²/4 + Σ c_j u^{2j+1}
  const logr = 0.5 * Math.log(ur * ur + ui * ui);
  const logi = Math.atan2(ui, ur);
  let re = PI2_6 - ur + (ur * logr - ui * logi);
  let im = -ui + (ur * logi + ui * logr);
  const u2r = ur * ur - ui * ui;
  const u2i = 2 * ur * ui;
  re -= u2r / 4;
  im -= u2i / 4;
  let pr = ur * u2r - ui * u2i; // u³
  let pi = ur * u2i + ui * u2r;
  for (let j = 0; j < LI2_ODD.length; j++) {
    re += LI2_ODD[j] * pr;
    im += LI2_ODD[j] * pi;
    const nr = pr * u2r - pi * u2i;
    pi = pr * u2i + pi * u2r;
    pr = nr;
  }
  return [re, im];
}
