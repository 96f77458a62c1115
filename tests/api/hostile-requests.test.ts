// Requests that broke the server from outside (issue 12, item 6): JSON nested thousands of levels
// deep gave 500 "Maximum call stack size exceeded" (zod and the error message recursed over it), and
// a Content-Encoding of deflate or br, or a gzip body that was not gzip, gave 500. Every JSON route
// must answer each with a 4xx in API.md's error shape, and the server log must hold no 5xx.
// Deflate, gzip and br are RFC 1950/1952/7932; "415 for an encoding the server does not take" is
// RFC 9110 §15.5.16. The rest is common practice, no source.
import { brotliCompressSync, deflateSync, gzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { errorBody } from '../../shared/api/errors';
import { jsonDepthOver, MAX_JSON_DEPTH } from '../../server/json-body';
import { probeSceneForSuite } from './probe-scene-suite';
import { concretePath, jsonRoutes, routeKey } from './route-samples';

const suite = probeSceneForSuite();

const nested = (open: string, inner: string, close: string, depth: number) => open.repeat(depth) + inner + close.repeat(depth);

/** The answer's status and error code, after checking it is API.md's error shape. */
function errorOf(res: { status: number; text: string }, where: string): { status: number; code: string } {
  const shape = errorBody.strict().safeParse(JSON.parse(res.text));
  if (!shape.success) throw new Error(`${where}: answered ${res.status} ${res.text.slice(0, 200)}, not API.md's error shape`);
  return { status: res.status, code: shape.data.error.code };
}

describe('the nesting depth of a JSON body', () => {
  it('is measured on the text, skipping brackets inside strings and escaped quotes', () => {
    expect(jsonDepthOver('[[[]]]', 3)).toBe(false);
    expect(jsonDepthOver('[[[[]]]]', 3)).toBe(true);
    expect(jsonDepthOver(JSON.stringify({ a: '[[[[[[', b: '\\"[[[[', c: [[1]] }), 3)).toBe(false);
    expect(jsonDepthOver(Buffer.from('{"ä":[{"ö":[[["é"]]]}]}'), 5)).toBe(true);
    expect(jsonDepthOver(Buffer.from('{"ä":[{"ö":[[["é"]]]}]}'), 6)).toBe(false);
  });

  it(`over ${MAX_JSON_DEPTH} levels (5,000 and 50,000 as an attacker sends them) is 400 too_deep on every JSON route`, async () => {
    const owner = { cookie: suite.scene.cookies['owner@kestrel.test'] ?? '' };
    const bodies = [
      nested('[', '', ']', 5000),
      nested('{"a":', '0', '}', 5000),
      `{"email":${nested('[', '"x"', ']', 50_000)},"password":"x"}`,
      nested('[', '', ']', MAX_JSON_DEPTH + 1),
    ];
    const wrong: string[] = [];
    for (const route of jsonRoutes(suite.t.app)) {
      for (const body of bodies) {
        const res = await suite.client.send(route.method, concretePath(route, suite.scene.ids), body, owner);
        const answer = errorOf(res, routeKey(route));
        if (answer.status !== 400 || answer.code !== 'too_deep') wrong.push(`${routeKey(route)} (${body.length} characters): ${res.status} ${res.text.slice(0, 120)}`);
      }
    }
    expect(wrong).toEqual([]);
  }, 120_000);

  it('up to the limit still reaches the route, whose schema answers', async () => {
    const res = await suite.client.send('POST', '/api/v1/auth/sign-in', `{"email":${nested('[', '"x"', ']', MAX_JSON_DEPTH - 1)},"password":"x"}`, {});
    expect(errorOf(res, 'sign-in')).toEqual({ status: 400, code: 'invalid_input' });
  });

  it('is checked on the decoded text of a UTF-16 body too', async () => {
    const body = Buffer.from(nested('[', '', ']', 5000), 'utf16le');
    const res = await suite.client.send('POST', '/api/v1/auth/sign-in', body, { 'content-type': 'application/json; charset=utf-16le' });
    expect(errorOf(res, 'sign-in')).toEqual({ status: 400, code: 'too_deep' });
  });
});

describe('a Content-Encoding', () => {
  const signIn = JSON.stringify({ email: 'nobody@kestrel.test', password: 'not the password' });
  const send = (body: string | Buffer, encoding: string) => suite.client.send('POST', '/api/v1/auth/sign-in', body, { 'content-encoding': encoding });

  it('gzip, deflate and br that decompress are read as the JSON inside (sign-in answers 401 to its wrong password)', async () => {
    for (const [name, compress] of [['gzip', gzipSync], ['deflate', deflateSync], ['br', brotliCompressSync]] as const) {
      expect(errorOf(await send(compress(signIn), name), name), name).toEqual({ status: 401, code: expect.any(String) });
    }
  });

  it('that the body does not follow (plain text, or cut short) is 400 invalid_encoding on every JSON route', async () => {
    const owner = { cookie: suite.scene.cookies['owner@kestrel.test'] ?? '' };
    const wrong: string[] = [];
    for (const route of jsonRoutes(suite.t.app)) {
      for (const [name, body] of [['gzip', signIn], ['deflate', signIn], ['br', signIn], ['gzip', gzipSync(signIn).subarray(0, 12)], ['br', brotliCompressSync(signIn).subarray(0, 5)]] as const) {
        const res = await suite.client.send(route.method, concretePath(route, suite.scene.ids), body, { ...owner, 'content-encoding': name });
        const answer = errorOf(res, routeKey(route));
        if (answer.status !== 400 || answer.code !== 'invalid_encoding') wrong.push(`${routeKey(route)} ${name}: ${res.status} ${res.text.slice(0, 120)}`);
      }
    }
    expect(wrong).toEqual([]);
  }, 120_000);

  it('the server does not take is 415 unsupported_encoding naming it', async () => {
    for (const name of ['compress', 'zstd', 'gzip, br', 'x-made-up']) {
      const res = await send(signIn, name);
      expect(errorOf(res, name), name).toEqual({ status: 415, code: 'unsupported_encoding' });
      expect(JSON.parse(res.text).error.message).toContain(JSON.stringify(name));
    }
  });

  it('a charset that is not Unicode is 415 unsupported_charset', async () => {
    const res = await suite.client.send('POST', '/api/v1/auth/sign-in', signIn, { 'content-type': 'application/json; charset=latin1' });
    expect(errorOf(res, 'latin1')).toEqual({ status: 415, code: 'unsupported_charset' });
  });
});

describe('the server log of all the requests above', () => {
  it('holds no answer of 5xx and no unhandled error', () => {
    expect(suite.t.logLines.filter((line) => line.includes('"status":5') || line.includes('unhandled error'))).toEqual([]);
  });
});
