/** What a topology matcher hands to the surroundings finder: devices with roles, nodes, loops. */
import type { DeviceRole, RectifierKind } from '../solve/equivalent-circuit';
import type { RectDevice } from './devices';
import type { Step } from './source-trace';

export interface Match {
  kind: RectifierKind;
  doubler?: 'full-wave' | 'half-wave';
  mixed?: boolean;
  devices: { device: RectDevice; role: DeviceRole }[];
  acNodes: string[];
  dcPositive: string;
  dcNegative: string;
  tap?: string;
  /**
   * The series loops that feed the rectifier, each oriented from an AC node: bridge, half-wave and
   * doubler one loop; centre tap one per half-winding (to the tap); three-phase one per phase (to
   * the neutral). Empty when no source was traced.
   */
  loops: Step[][];
  /** Node pairs of the capacitor slots: one for most kinds; doubler [lower or series, upper or output]. */
  capacitorSlots: [string, string][];
}
