import { describe, expect, it } from 'vitest';
import { installServer, SetupError } from '../../scripts/db';

describe('PostgreSQL set-up', () => {
  it('without root, a missing server install gives the exact command, not a stack trace', () => {
    expect(() => installServer(false)).toThrowError(SetupError);
    expect(() => installServer(false)).toThrowError(/apt-get install -y postgresql/);
  });
});
