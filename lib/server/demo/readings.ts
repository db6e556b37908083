import 'server-only';
import type { Transaction } from 'sequelize';

/** Raw field readings of the demo's walked sites (filled in with the engine's reading shapes). */
export async function seedDemoReadings(_transaction: Transaction): Promise<void> {
  // Readings are added once the engine's reading shapes are final.
}
