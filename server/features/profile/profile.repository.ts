import type { Profile } from '../../../shared/profile';
import { BowlerProfile } from '../../models/index';

export function toProfileDto(p: BowlerProfile): Profile {
  return {
    hand: p.hand,
    speedMph: p.speedMph,
    revRpm: p.revRpm,
    axisRotationDeg: p.axisRotationDeg,
    axisTiltDeg: p.axisTiltDeg,
    papRightIn: p.papRightIn,
    papUpIn: p.papUpIn,
    units: p.units,
  };
}

export const profileRepository = {
  findByUser(userId: number): Promise<BowlerProfile | null> {
    return BowlerProfile.findByPk(userId);
  },
  async upsert(userId: number, data: Profile): Promise<BowlerProfile> {
    const existing = await BowlerProfile.findByPk(userId);
    if (existing) return existing.update(data);
    return BowlerProfile.create({ userId, ...data });
  },
};
