import { describe, expect, it } from 'vitest';
import { navItemsFor, splitNav } from '../../client/src/components/appLayoutNavItems';
import { primaryRole, roleSetProblem } from '../../shared/auth';

describe('top bar navigation', () => {
  it('shows an entry to anyone holding one of its roles', () => {
    const labels = (roles: Parameters<typeof navItemsFor>[0]) => navItemsFor(roles).map((i) => i.label);
    expect(labels(['bowler'])).not.toContain('Center admin');
    expect(labels(['bowler', 'proprietor'])).toContain('Center admin');
    expect(labels('admin')).toEqual(expect.arrayContaining(['Admin', 'Dev mailbox', 'Center admin']));
    expect(labels(null)).toEqual([]);
  });

  it('keeps every link when they fit, else moves the lowest-kept links to More until the rest and More fit', () => {
    const items = navItemsFor(['admin']);
    const widths = items.map(() => 80);
    const all = splitNav(items, widths, 80 * items.length, 96);
    expect(all.more).toEqual([]);
    const available = 900; // an admin's bar at 1280 px, roughly
    const { shown, more } = splitNav(items, widths, available, 96);
    expect(shown.length * 80 + 96).toBeLessThanOrEqual(available);
    expect((shown.length + 1) * 80 + 96).toBeGreaterThan(available);
    expect(shown.map((i) => i.label)).toContain('Admin');
    expect(more.map((i) => i.label)).toContain('Decide');
    // Shown links keep their order; together with More they are every entry once.
    expect([...shown, ...more].map((i) => i.name).sort()).toEqual(items.map((i) => i.name).sort());
    expect(shown.map((i) => i.name)).toEqual(items.filter((i) => shown.includes(i)).map((i) => i.name));
  });
});

describe('role sets', () => {
  it('allows any mix of bowler, coach and proprietor; admin alone; the highest role leads', () => {
    expect(roleSetProblem(['bowler', 'coach', 'proprietor'])).toBeNull();
    expect(roleSetProblem(['admin'])).toBeNull();
    expect(roleSetProblem(['admin', 'bowler'])).toMatch(/admin role alone/);
    expect(roleSetProblem([])).toMatch(/at least one/);
    expect(primaryRole(['bowler', 'coach'])).toBe('coach');
    expect(primaryRole(['coach', 'proprietor'])).toBe('proprietor');
  });
});
