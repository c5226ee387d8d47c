import { afterAll, afterEach } from 'vitest';
import { takeContractFailures } from './response-contract';

/** Fails the test (or, for requests made in set-up, the file) that received an answer its contract refuses. */
function failOnBrokenContracts() {
  const failures = takeContractFailures();
  if (failures.length > 0) throw new Error(`The API broke its response contracts:\n\n${failures.join('\n\n')}`);
}

afterEach(failOnBrokenContracts);
afterAll(failOnBrokenContracts);
