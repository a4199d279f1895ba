import type { Command } from '../kit.js';

/** Commands of this layer (none yet). */
export const commands: readonly Command[] = [];
