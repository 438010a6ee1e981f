import { createServer } from 'node:net';
import { DriverException } from '@mikro-orm/core';
import pg from 'pg';
import { describe, expect, test } from 'vitest';
import { expectErrorOutput } from '../helpers/error-output';
import { errorResponse } from '~/lib/server/errors';
import { isUnavailable } from '~/lib/server/unavailable';

/** The error node-postgres really gives when nothing listens on the port. */
async function refusedConnectionError(): Promise<Error> {
  const port = await new Promise<number>((resolve) => {
    const server = createServer().listen(0, '127.0.0.1', () => {
      const address = server.address();
      server.close(() => resolve(typeof address === 'object' && address ? address.port : 0));
    });
  });
  const client = new pg.Client({ host: '127.0.0.1', port, user: 'nobody', database: 'none' });
  return client.connect().then(
    () => new Error('unexpectedly connected'),
    (error: Error) => error,
  );
}

/** A server error as node-postgres builds it from the server's message (a DatabaseError with its SQLSTATE). */
function serverError(code: string, message: string): Error {
  return Object.assign(new pg.DatabaseError(message, 0, 'error'), { code });
}

describe('isUnavailable', () => {
  test('a refused connection, raw or as MikroORM wraps it, is an outage', async () => {
    const refused = await refusedConnectionError();
    expect((refused as { code?: string }).code).toBe('ECONNREFUSED');
    expect(isUnavailable(refused)).toBe(true);
    expect(isUnavailable(new DriverException(refused))).toBe(true);
    expect(isUnavailable(new Error('could not load the firm', { cause: refused }))).toBe(true);
  });

  test('the server shutting down, restarting or full is an outage', () => {
    // Source: PostgreSQL 15 manual, Appendix A "PostgreSQL Error Codes".
    expect(isUnavailable(serverError('57P01', 'terminating connection due to administrator command'))).toBe(true);
    expect(isUnavailable(serverError('57P03', 'the database system is starting up'))).toBe(true);
    expect(isUnavailable(serverError('08006', 'connection failure'))).toBe(true);
    expect(isUnavailable(serverError('53300', 'sorry, too many clients already'))).toBe(true);
    // What node-postgres says when the socket closes under a query (it carries no code).
    expect(isUnavailable(new Error('Connection terminated unexpectedly'))).toBe(true);
  });

  test('faults in our own queries or code are not an outage', () => {
    // Source: PostgreSQL 15 manual, Appendix A: 23505 unique_violation, 42P01 undefined_table, 57014 query_canceled.
    expect(isUnavailable(serverError('23505', 'duplicate key value violates unique constraint'))).toBe(false);
    expect(isUnavailable(serverError('42P01', 'relation "rate_book" does not exist'))).toBe(false);
    expect(isUnavailable(serverError('57014', 'canceling statement due to statement timeout'))).toBe(false);
    expect(isUnavailable(new TypeError("Cannot read properties of undefined (reading 'id')"))).toBe(false);
    expect(isUnavailable('a string')).toBe(false);
    expect(isUnavailable(null)).toBe(false);
  });
});

describe('errorResponse', () => {
  test('an outage answers 503 with Retry-After and the JSON error shape', async () => {
    const response = errorResponse(new DriverException(await refusedConnectionError()), { Vary: 'Origin' });
    expect(response.status).toBe(503);
    expect(Number(response.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(response.headers.get('vary')).toBe('Origin');
    expect(await response.json()).toEqual({ error: expect.any(String) });
  });

  test('any other unknown error answers a bare 500 and is logged as an error', async () => {
    const output = expectErrorOutput();
    const response = errorResponse(new TypeError('a bug'));
    expect(response.status).toBe(500);
    expect(await response.json()).toEqual({ error: 'Something went wrong on our side. Please try again.' });
    expect(output.join('\n')).toContain('unexpected error; answered 500');
  });
});
