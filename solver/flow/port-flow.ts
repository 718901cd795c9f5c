/**
 * Flow rate through each port, positive when liquid enters the fluid (physics.md §3):
 *
 *   Q_k = −d ∫_port u·n_out ds = −d Σ_{port faces f, parts of port k} σ_f ℓ_{f,k} u_f      (m³/s)
 *
 * Summed over the ports this is −d Σ_c (B u)_c (divergence.ts): zero to the solver's continuity residual.
 */
import type { PortFaces } from './port-faces';

export function portFlowRates(ports: PortFaces, u: Float64Array, v: Float64Array, depth: number, portCount: number): Float64Array {
  const q = new Float64Array(portCount);
  for (let p = 0; p < ports.partFace.length; p++) {
    const f = ports.partFace[p];
    const vel = ports.axis[f] === 0 ? u[ports.node[f]] : v[ports.node[f]];
    q[ports.partPort[p]] -= depth * ports.sign[f] * ports.partLength[p] * vel;
  }
  return q;
}
