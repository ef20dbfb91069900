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
