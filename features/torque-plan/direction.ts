import { TorquePlanError } from './errors';

export type WheelPosition = 'LF' | 'RF' | 'LR' | 'RR' | 'spare';
export const WHEEL_POSITIONS: readonly WheelPosition[] = ['LF', 'RF', 'LR', 'RR', 'spare'];

export type ArrowDirection =
  | {
      side: 'left' | 'right';
      seenFromOutside: 'clockwise' | 'counterclockwise';
      instruction: string;
    }
  | { side: null; seenFromOutside: null; instruction: string };

/**
 * Which way a directional tire's rotation arrow must point. Rolling forward, the top of every
 * wheel moves toward the front: seen from outside the vehicle that is counterclockwise on the
 * left side and clockwise on the right.
 */
export function arrowDirection(position: WheelPosition): ArrowDirection {
  switch (position) {
    case 'LF':
    case 'LR':
      return {
        side: 'left',
        seenFromOutside: 'counterclockwise',
        instruction:
          'Left side: standing outside the wheel, the arrow turns counterclockwise (top of the tire toward the front).',
      };
    case 'RF':
    case 'RR':
      return {
        side: 'right',
        seenFromOutside: 'clockwise',
        instruction:
          'Right side: standing outside the wheel, the arrow turns clockwise (top of the tire toward the front).',
      };
    case 'spare':
      return {
        side: null,
        seenFromOutside: null,
        instruction:
          'Spare: its side is not known. Check the arrow again when it goes on the vehicle.',
      };
    default:
      throw new TorquePlanError(
        `Unknown wheel position "${String(position)}". Use LF, RF, LR, RR or spare.`,
        'position',
      );
  }
}
