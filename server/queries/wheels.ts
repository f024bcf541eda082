import { Wheel, WheelMeasurement } from '../models';

/** A member's logged wheels (or the one with `id`), with their measurements, oldest first. */
export function wheelsOf(ownerId: number, id?: number): Promise<Wheel[]> {
  return Wheel.findAll({ where: { ownerId, ...(id ? { id } : {}) }, include: [{ model: WheelMeasurement, as: 'measurements' }], order: [['id', 'ASC']] });
}
