import { describe, expect, it } from 'vitest';
import { analyzePattern } from '../../../engine/index';
import { Pattern } from '../../../server/models/index';
import { api, createUser, errorOf, uniqueMarker } from '../../helpers/api';
import { createPattern, LONG_HEAVY } from '../../helpers/fixtures';

const upload = (
  auth: { Authorization: string },
  name: string,
  body: string,
  type = name.endsWith('.json') ? 'application/json' : 'text/csv',
) => api.post('/api/patterns/import').set(auth).attach('file', Buffer.from(body), { filename: name, contentType: type });

describe('pattern files', () => {
  it('exports JSON and CSV that import back to the same sweeps and numbers', async () => {
    const coach = await createUser('coach');
    const p = await createPattern(coach.user.id, LONG_HEAVY);
    for (const format of ['json', 'csv'] as const) {
      // Names are unique per owner, so another coach imports each file under the same name.
      const second = await createUser('coach');
      const file = await api.get(`/api/patterns/${p.id}/export`).query({ format }).set(coach.auth);
      expect(file.status).toBe(200);
      expect(file.headers['content-disposition']).toMatch(/attachment; filename=".*\.lanewright\.(json|csv)"/);
      const again = await upload(second.auth, `back.${format}`, file.text);
      expect(again.status).toBe(201);
      expect(again.body.item.sweeps).toEqual(LONG_HEAVY);
      expect(again.body.item.name).toBe(p.name);
      expect(again.body.item.summary).toEqual(analyzePattern({ name: p.name, sweeps: LONG_HEAVY }));
    }
  });

  it('rejects a JSON file with bad sweeps, naming each line, and saves nothing', async () => {
    const coach = await createUser('coach');
    const name = uniqueMarker('Broken JSON');
    const text = [
      '{',
      '  "format": "lanewright-pattern",',
      '  "version": 1,',
      `  "name": ${JSON.stringify(name)},`,
      '  "sweeps": [',
      '    { "direction": "forward", "fromBoard": 2, "toBoard": 38, "startFt": 0, "endFt": 40, "crossings": 2, "microlitersPerBoard": 50 },',
      '    { "direction": "sideways", "fromBoard": 2, "toBoard": 38, "startFt": 0, "endFt": 40, "crossings": 2, "microlitersPerBoard": 50 },',
      '    { "direction": "reverse", "fromBoard": 41, "toBoard": 38, "startFt": 0, "endFt": 40, "crossings": 2, "microlitersPerBoard": 50 }',
      '  ]',
      '}',
    ].join('\n');
    const res = await upload(coach.auth, 'broken.json', text);
    expect(res.status).toBe(400);
    const e = errorOf(res.body);
    expect(e.code).toBe('invalid_pattern_file');
    expect(Object.keys(e.fields ?? {}).sort()).toEqual(['lines.7.sweeps.1.direction', 'lines.8.sweeps.2.fromBoard']);
    expect(await Pattern.count({ where: { name } })).toBe(0);
  });

  it('rejects malformed JSON with the line of the fault', async () => {
    const coach = await createUser('coach');
    const res = await upload(coach.auth, 'bad.json', '{\n  "format": "lanewright-pattern",\n  "name": "x"\n  "sweeps": []\n}');
    expect(res.status).toBe(400);
    expect(Object.keys(errorOf(res.body).fields ?? {})[0]).toMatch(/^lines\.4\./);
  });

  it('rejects a CSV with bad lines, naming each line, and saves nothing', async () => {
    const coach = await createUser('coach');
    const name = uniqueMarker('Bad CSV');
    const csv =
      `# lanewright-pattern v1\n# name: ${name}\n` +
      'direction,fromBoard,toBoard,startFt,endFt,crossings,microlitersPerBoard\nforward,2,38,0,40,2,50\nforward,2,38,30,12,2,50\nreverse,2,38,0,40,0,50\n';
    const res = await upload(coach.auth, 'bad.csv', csv);
    expect(res.status).toBe(400);
    expect(Object.keys(errorOf(res.body).fields ?? {}).sort()).toEqual(['lines.5.endFt', 'lines.6.crossings']);
    expect(await Pattern.count({ where: { name } })).toBe(0);
  });

  it('refuses another file type and a bowler', async () => {
    const coach = await createUser('coach');
    expect((await upload(coach.auth, 'pattern.txt', 'hello', 'text/plain')).status).toBe(400);
    const bowler = await createUser();
    expect((await upload(bowler.auth, 'p.json', '{}')).status).toBe(403);
  });

  it('duplicates a pattern as the caller’s own copy', async () => {
    const coach = await createUser('coach');
    const other = await createUser('proprietor');
    const p = await createPattern(other.user.id, LONG_HEAVY);
    const res = await api.post(`/api/patterns/${p.id}/duplicate`).set(coach.auth);
    expect(res.status).toBe(201);
    expect(res.body.item).toMatchObject({ name: `${p.name} (copy)`, ownerId: coach.user.id, sweeps: LONG_HEAVY });
  });
});
