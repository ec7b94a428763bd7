/**
 * Vincenty's inverse formula on the WGS-84 ellipsoid: T. Vincenty, "Direct and inverse
 * solutions of geodesics on the ellipsoid with application of nested equations", Survey
 * Review 23 (176), 1975, 88–93 (equations as printed there). Written here as an independent
 * reference for the geodesic tests: an iterative series method, unrelated to Karney's
 * algorithm, accurate to about 0.5 mm away from nearly antipodal points.
 */
const A = 6378137; // WGS-84, exact by definition
const F = 1 / 298.257223563; // WGS-84, exact by definition
const B = A * (1 - F);
const DEG = Math.PI / 180;

export function vincentyInverse(lat1: number, lon1: number, lat2: number, lon2: number) {
  const L = (lon2 - lon1) * DEG;
  const U1 = Math.atan((1 - F) * Math.tan(lat1 * DEG));
  const U2 = Math.atan((1 - F) * Math.tan(lat2 * DEG));
  const [sinU1, cosU1, sinU2, cosU2] = [Math.sin(U1), Math.cos(U1), Math.sin(U2), Math.cos(U2)];
  let lambda = L;
  let sinSigma = 0;
  let cosSigma = 1;
  let sigma = 0;
  let cos2Alpha = 1;
  let cos2SigmaM = 0;
  for (let iter = 0; iter < 200; iter++) {
    const sinL = Math.sin(lambda);
    const cosL = Math.cos(lambda);
    sinSigma = Math.hypot(cosU2 * sinL, cosU1 * sinU2 - sinU1 * cosU2 * cosL);
    if (sinSigma === 0) return { s: 0, azi1: 0, azi2: 0 };
    cosSigma = sinU1 * sinU2 + cosU1 * cosU2 * cosL;
    sigma = Math.atan2(sinSigma, cosSigma);
    const sinAlpha = (cosU1 * cosU2 * sinL) / sinSigma;
    cos2Alpha = 1 - sinAlpha * sinAlpha;
    cos2SigmaM = cos2Alpha === 0 ? 0 : cosSigma - (2 * sinU1 * sinU2) / cos2Alpha;
    const C = (F / 16) * cos2Alpha * (4 + F * (4 - 3 * cos2Alpha));
    const next =
      L +
      (1 - C) *
        F *
        sinAlpha *
        (sigma + C * sinSigma * (cos2SigmaM + C * cosSigma * (-1 + 2 * cos2SigmaM ** 2)));
    const done = Math.abs(next - lambda) < 1e-13;
    lambda = next;
    if (done) break;
  }
  const u2 = (cos2Alpha * (A * A - B * B)) / (B * B);
  const bigA = 1 + (u2 / 16384) * (4096 + u2 * (-768 + u2 * (320 - 175 * u2)));
  const bigB = (u2 / 1024) * (256 + u2 * (-128 + u2 * (74 - 47 * u2)));
  const deltaSigma =
    bigB *
    sinSigma *
    (cos2SigmaM +
      (bigB / 4) *
        (cosSigma * (-1 + 2 * cos2SigmaM ** 2) -
          (bigB / 6) * cos2SigmaM * (-3 + 4 * sinSigma ** 2) * (-3 + 4 * cos2SigmaM ** 2)));
  const s = B * bigA * (sigma - deltaSigma);
  const sinL = Math.sin(lambda);
  const cosL = Math.cos(lambda);
  const azi1 = Math.atan2(cosU2 * sinL, cosU1 * sinU2 - sinU1 * cosU2 * cosL) / DEG;
  const azi2 = Math.atan2(cosU1 * sinL, -sinU1 * cosU2 + cosU1 * sinU2 * cosL) / DEG;
  return { s, azi1: (azi1 + 360) % 360, azi2: (azi2 + 360) % 360 };
}
