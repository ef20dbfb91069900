import { describe, expect, it } from 'vitest';
import { upkeepDue, UPKEEP_DEFAULTS } from '../../../engine/index';

// Intervals: a full resurface every 60–100 games and an oil extraction every 30–60 games (common practice; sources
// differ within those ranges). The reminder uses the lower ends; "soon" is the last 10 % (at least 3 games), the
// project's own choice.

describe('upkeepDue', () => {
  it('defaults are the lower ends of the common ranges: 60 games to a resurface, 30 to an extraction', () => {
    expect(UPKEEP_DEFAULTS).toEqual({ resurfaceGames: 60, extractionGames: 30 });
  });

  it('a spare ball at 200 games is overdue for both', () => {
    const u = upkeepDue({ gamesSinceResurface: 200, gamesSinceExtraction: 200 });
    expect(u.resurface).toEqual({ games: 200, interval: 60, remaining: 0, state: 'due' });
    expect(u.extraction).toEqual({ games: 200, interval: 30, remaining: 0, state: 'due' });
  });

  it('exactly at the interval is due; 6 games before 60 is soon (10 %); 7 before is fine', () => {
    expect(upkeepDue({ gamesSinceResurface: 60, gamesSinceExtraction: 0 }).resurface.state).toBe('due');
    expect(upkeepDue({ gamesSinceResurface: 54, gamesSinceExtraction: 0 }).resurface).toMatchObject({ remaining: 6, state: 'soon' });
    expect(upkeepDue({ gamesSinceResurface: 53, gamesSinceExtraction: 0 }).resurface).toMatchObject({ remaining: 7, state: 'ok' });
  });

  it('a short interval still warns 3 games ahead; the user’s own intervals replace the defaults', () => {
    const u = upkeepDue({ gamesSinceResurface: 40, gamesSinceExtraction: 17, intervals: { resurfaceGames: 90, extractionGames: 20 } });
    expect(u.resurface).toMatchObject({ interval: 90, remaining: 50, state: 'ok' });
    expect(u.extraction).toMatchObject({ interval: 20, remaining: 3, state: 'soon' });
  });

  it('refuses negative games and an interval outside 5–500', () => {
    expect(() => upkeepDue({ gamesSinceResurface: -1, gamesSinceExtraction: 0 })).toThrow(RangeError);
    expect(() => upkeepDue({ gamesSinceResurface: 0, gamesSinceExtraction: 0, intervals: { extractionGames: 2 } })).toThrow(
      /extractionGames/,
    );
  });
});
