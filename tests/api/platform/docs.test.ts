import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { CONFIG_VARIABLES } from '../../../server/config/index';
import { api } from '../../helpers/api';
import { root } from '../../helpers/database';

describe('API documentation', () => {
  it('serves an OpenAPI 3.1 document generated from the zod schemas', async () => {
    const res = await api.get('/api/docs/openapi.json');
    expect(res.status).toBe(200);
    expect(res.body.openapi).toBe('3.1.0');
    const login = res.body.paths['/api/auth/login'].post;
    expect(login.requestBody.content['application/json'].schema.properties).toHaveProperty('email');
    // A matchup is for a pattern (on a lane surface) or for a published condition: neither id is required on its own.
    const matchup = res.body.paths['/api/matchups'].post.requestBody.content['application/json'].schema;
    expect(Object.keys(matchup.properties)).toEqual(expect.arrayContaining(['patternId', 'conditionId', 'lane', 'gamesBowled']));
    expect(matchup.properties.lane.properties.kind.enum).toEqual(['wood', 'synthetic']);
    expect(matchup.properties.lane.properties.friction.enum).toEqual(['low', 'medium', 'high']);
    expect(res.body.paths['/api/arsenal/{id}'].get.parameters[0]).toMatchObject({ name: 'id', in: 'path', required: true });
  });

  it('documents each answer with the response schema of its route in the table', async () => {
    const res = await api.get('/api/docs/openapi.json');
    const ball = res.body.paths['/api/arsenal/{id}'].get.responses['200'].content['application/json'].schema.properties.item;
    expect(Object.keys(ball.properties)).toEqual(expect.arrayContaining(['id', 'surfaceGrit', 'polished', 'layout', 'version']));
    // The matchup answer carries the calibration the client's what-if uses.
    const matchup = res.body.paths['/api/matchups'].post.responses['200'].content['application/json'].schema;
    expect(matchup.properties.calibration.properties.fit).toBeDefined();
    expect(matchup.required).toEqual(expect.arrayContaining(['pattern', 'lane', 'calibration', 'rankings']));
    // A second success status and a no-content answer are documented as such.
    const shot = res.body.paths['/api/sessions/{id}/shots'].post;
    expect(Object.keys(shot.responses)).toEqual(expect.arrayContaining(['200', '201', '400', '401']));
    expect(shot.parameters.find((p: { in: string }) => p.in === 'header')).toMatchObject({ name: 'idempotency-key', required: true });
    expect(res.body.paths['/api/arsenal/{id}'].delete.responses['204'].content).toBeUndefined();
    // Public routes carry no bearer requirement; signed-in ones do.
    expect(res.body.paths['/api/centers'].get.security).toBeUndefined();
    expect(res.body.paths['/api/arsenal'].get.security).toEqual([{ bearer: [] }]);
  });

  it('serves a readable page listing the routes', async () => {
    const res = await api.get('/api/docs').set('Accept', 'text/html');
    expect(res.status).toBe(200);
    expect(res.text).toContain('<table>');
    expect(res.text).toContain('/api/centers/{id}/conditions/current.pdf');
  });
});

describe('README, Configuration', () => {
  it('lists every environment variable server/config reads, each in the table', () => {
    const readme = fs.readFileSync(path.join(root, 'README.md'), 'utf8');
    const section = readme.slice(readme.indexOf('\n## Configuration'), readme.indexOf('\n## ', readme.indexOf('\n## Configuration') + 5));
    const rows = section.split('\n').filter((l) => l.startsWith('| `'));
    const listed = new Set(rows.flatMap((r) => [...r.split('|')[1].matchAll(/`([A-Z][A-Z0-9_]*)`/g)].map((m) => m[1])));
    expect(CONFIG_VARIABLES.length).toBeGreaterThan(30);
    expect(CONFIG_VARIABLES.filter((v) => !listed.has(v))).toEqual([]);
  });
});
