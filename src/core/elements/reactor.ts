// Shunt reactors: a fixed reactance, so the absorbed kvar scales with the voltage squared.

/** Absorbed reactive power, kvar (> 0): Qr·(U/Ur)². */
export function shuntReactorKvar(qRatedKvar: number, uRatedKv: number, uKv = uRatedKv): number {
  const ur = uKv / uRatedKv;
  return qRatedKvar * (ur * ur);
}
