/**
 * The demo's machines (our own invented scenario and parameters; demo data only, never expected values of
 * tests except through the handbook formulas below applied to these parameters).
 */

export const standardGravity = 9.80665;

/**
 * Quay crane trolley: a trolley of mass M on a rail (position x), a load of mass m hanging on a rope of
 * length l (angle th from the downward vertical), a drive force F on the trolley. A pendulum on a driven
 * cart: L = (M+m)/2 dx^2 + m l dx dth cos th + m l^2/2 dth^2 + m g l cos th (control textbooks' cart with a
 * pendulum, hanging form), so
 *   (M+m) ddx + m l (ddth cos th - dth^2 sin th) = F,   l ddth + ddx cos th + g sin th = 0.
 */
export const quayCrane = {
  trolleyMass: 8600,
  loadMass: 21000,
  ropeLength: 11,
  accelerations(th: number, dth: number, force: number): [number, number] {
    const { trolleyMass: M, loadMass: m, ropeLength: l } = quayCrane;
    const s = Math.sin(th);
    const c = Math.cos(th);
    const ddx = (force + m * s * (l * dth * dth + standardGravity * c)) / (M + m * s * s);
    const ddth = -(ddx * c + standardGravity * s) / l;
    return [ddx, ddth];
  },
  /** The energy terms and coefficients of the Lagrangian above (E = T + V). */
  energyTerms(): Record<string, number> {
    const { trolleyMass: M, loadMass: m, ropeLength: l } = quayCrane;
    return { 'dx^2': (M + m) / 2, 'dx*dth*cos(th)': m * l, 'dth^2': (m * l * l) / 2, 'cos(th)': -m * standardGravity * l };
  },
};

/**
 * Two-link inspection arm hanging below a gantry, moving in a vertical plane: shoulder angle sh from the
 * downward vertical, elbow angle el relative to the upper link, point masses m1 at the elbow and m2 (the
 * tool) at the tip, links l1 and l2, joint torques. The double pendulum of Landau & Lifshitz (Mechanics,
 * sec. 5, problem 1) with phi1 = sh, phi2 = sh + el:
 *   M(el) [ddsh, ddel] + C + G = [torque_sh, torque_el] with
 *   M11 = (m1+m2) l1^2 + m2 l2^2 + 2 m2 l1 l2 cos el, M12 = m2 l2^2 + m2 l1 l2 cos el, M22 = m2 l2^2,
 *   C = m2 l1 l2 sin el [-(2 dsh del + del^2), dsh^2], G = g [(m1+m2) l1 sin sh + m2 l2 sin(sh+el), m2 l2 sin(sh+el)].
 */
export const inspectionArm = {
  elbowMass: 2.1,
  toolMass: 1.4,
  upperLink: 0.62,
  foreLink: 0.47,
  accelerations(sh: number, el: number, dsh: number, del: number, torqueSh: number, torqueEl: number): [number, number] {
    const { elbowMass: m1, toolMass: m2, upperLink: l1, foreLink: l2 } = inspectionArm;
    const g = standardGravity;
    const c = Math.cos(el);
    const h = m2 * l1 * l2 * Math.sin(el);
    const m11 = (m1 + m2) * l1 * l1 + m2 * l2 * l2 + 2 * m2 * l1 * l2 * c;
    const m12 = m2 * l2 * l2 + m2 * l1 * l2 * c;
    const m22 = m2 * l2 * l2;
    const r1 = torqueSh + h * (2 * dsh * del + del * del) - g * ((m1 + m2) * l1 * Math.sin(sh) + m2 * l2 * Math.sin(sh + el));
    const r2 = torqueEl - h * dsh * dsh - g * m2 * l2 * Math.sin(sh + el);
    const det = m11 * m22 - m12 * m12;
    return [(m22 * r1 - m12 * r2) / det, (m11 * r2 - m12 * r1) / det];
  },
  energyTerms(): Record<string, number> {
    const { elbowMass: m1, toolMass: m2, upperLink: l1, foreLink: l2 } = inspectionArm;
    const g = standardGravity;
    return {
      'dsh^2': ((m1 + m2) * l1 * l1 + m2 * l2 * l2) / 2,
      'del^2': (m2 * l2 * l2) / 2,
      'dsh*del': m2 * l2 * l2,
      'dsh^2*cos(el)': m2 * l1 * l2,
      'dsh*del*cos(el)': m2 * l1 * l2,
      'cos(sh)': -(m1 + m2) * g * l1,
      'cos(sh + el)': -m2 * g * l2,
    };
  },
};
