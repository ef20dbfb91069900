import { QueryTypes } from 'sequelize';
import type { Profile } from '../../../shared/profile';
import { BowlerProfile, sequelize } from '../../models/index';

export function toProfileDto(p: BowlerProfile | Profile): Profile {
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
  /**
   * Saves the whole profile in one statement, INSERT … ON CONFLICT (user_id) DO UPDATE: the first save of a
   * new account and a later one take the same path, so concurrent saves never race to insert (a unique
   * violation) nor lose an optimistic-lock check; the last save wins and the version counts every save.
   */
  async upsert(userId: number, data: Profile): Promise<Profile> {
    const rows = await sequelize.query<{
      hand: Profile['hand'];
      speed_mph: number;
      rev_rpm: number;
      axis_rotation_deg: number;
      axis_tilt_deg: number;
      pap_right_in: number | null;
      pap_up_in: number | null;
      units: Profile['units'];
    }>(
      `INSERT INTO bowler_profiles (user_id, hand, speed_mph, rev_rpm, axis_rotation_deg, axis_tilt_deg, pap_right_in, pap_up_in, units, version, created_at, updated_at)
       VALUES (:userId, :hand, :speedMph, :revRpm, :axisRotationDeg, :axisTiltDeg, :papRightIn, :papUpIn, :units, 0, now(), now())
       ON CONFLICT (user_id) DO UPDATE SET hand = EXCLUDED.hand, speed_mph = EXCLUDED.speed_mph, rev_rpm = EXCLUDED.rev_rpm,
         axis_rotation_deg = EXCLUDED.axis_rotation_deg, axis_tilt_deg = EXCLUDED.axis_tilt_deg, pap_right_in = EXCLUDED.pap_right_in,
         pap_up_in = EXCLUDED.pap_up_in, units = EXCLUDED.units, version = bowler_profiles.version + 1, updated_at = now()
       RETURNING hand, speed_mph, rev_rpm, axis_rotation_deg, axis_tilt_deg, pap_right_in, pap_up_in, units`,
      { replacements: { userId, ...data }, type: QueryTypes.SELECT },
    );
    const r = rows[0];
    return {
      hand: r.hand,
      speedMph: r.speed_mph,
      revRpm: r.rev_rpm,
      axisRotationDeg: r.axis_rotation_deg,
      axisTiltDeg: r.axis_tilt_deg,
      papRightIn: r.pap_right_in,
      papUpIn: r.pap_up_in,
      units: r.units,
    };
  },
};
