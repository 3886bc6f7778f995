import { describe, expect, it } from 'vitest';
import { isDatabaseUnavailable } from '../../server/errors.js';

describe('telling a database that is gone from a query that is wrong', () => {
  it('sees a refused or lost connection, also wrapped as Drizzle wraps driver errors', () => {
    const refused = Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:3306'), { code: 'ECONNREFUSED' });
    expect(isDatabaseUnavailable(refused)).toBe(true);
    expect(isDatabaseUnavailable(new Error('Failed query: select 1', { cause: refused }))).toBe(true);
    expect(isDatabaseUnavailable(Object.assign(new Error('Connection lost: The server closed the connection.'), { code: 'PROTOCOL_CONNECTION_LOST', fatal: true }))).toBe(true);
    expect(isDatabaseUnavailable(new Error('Pool is closed.'))).toBe(true);
  });

  it('leaves a duplicate key, a syntax error and a plain bug to the usual handling', () => {
    expect(isDatabaseUnavailable(Object.assign(new Error('Duplicate entry'), { code: 'ER_DUP_ENTRY' }))).toBe(false);
    expect(isDatabaseUnavailable(Object.assign(new Error('You have an error in your SQL syntax'), { code: 'ER_PARSE_ERROR' }))).toBe(false);
    expect(isDatabaseUnavailable(new TypeError('x is undefined'))).toBe(false);
    expect(isDatabaseUnavailable(null)).toBe(false);
  });
});
