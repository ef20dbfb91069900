import { DEFAULT_PROFILE, ProfileSchema, type Profile, type ProfileUpdate } from '../../../shared/profile';
import { AppError } from '../../lib/AppError';
import { fieldErrors } from '../../middleware/validate';
import { refitBowlerAfterCommit } from '../stats/calibrationJobs';
import { profileRepository, toProfileDto } from './profile.repository';

export const profileService = {
  /** The bowler's saved profile, or the typical starting values when none was saved. */
  async get(userId: number): Promise<{ profile: Profile; saved: boolean }> {
    const p = await profileRepository.findByUser(userId);
    return p ? { profile: toProfileDto(p), saved: true } : { profile: { ...DEFAULT_PROFILE }, saved: false };
  },
  /** Merges the given fields into the current profile and saves the whole, validated again. */
  async update(userId: number, patch: ProfileUpdate): Promise<Profile> {
    const { profile } = await this.get(userId);
    const merged = ProfileSchema.safeParse({ ...profile, ...patch });
    if (!merged.success) throw AppError.badRequest('Some fields are not valid', fieldErrors('body', merged.error));
    const saved = await profileRepository.upsert(userId, merged.data);
    refitBowlerAfterCommit(userId); // the fits are made with the bowler's release
    return saved;
  },
};
