/**
 * The drag-crisis warning, for the analysis and the planner alike. Only a smooth, rounded body has a drag crisis: the
 * boundary layer turns turbulent and its separation point moves back, so C_d drops sharply (a smooth sphere from about
 * 0.5 to about 0.1 between Re 2e5 and 5e5; common practice). A box's, a disc's or a cylinder's sharp edges fix
 * separation (a cylinder here falls axis vertical and a disc flat), and a custom shape is not known to be smooth and
 * round: none of them is warned.
 */
import type { PhysicsWarning } from './physicsWarning';
import type { SpecimenShape } from './specimenGeometry';
import { DRAG_CRISIS_REYNOLDS } from './standardSphereDrag';

export function dragCrisisWarning(shape: SpecimenShape, impactReynolds: readonly number[]): PhysicsWarning | null {
  if (shape !== 'sphere') return null;
  if (!impactReynolds.some((re) => re >= DRAG_CRISIS_REYNOLDS[0] && re <= DRAG_CRISIS_REYNOLDS[1])) return null;
  const maxRe = Math.max(...impactReynolds);
  return {
    code: 'near-drag-crisis',
    message: `The Reynolds number at impact (up to ${maxRe.toPrecision(3)}) lies in the drag crisis (2e5 to 5e5), where C_d can drop sharply with small changes in speed or surface roughness; repeated drops may disagree.`,
  };
}
