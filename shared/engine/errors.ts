/**
 * Thrown for input a player or teacher got wrong (an unknown chord, a pair that shares a note,
 * a start outside the range). The message is written to be shown to them as it is.
 *
 * @example
 * try { parseTriad('H') } catch (e) { if (e instanceof EngineError) console.log(e.message) }
 */
export class EngineError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'EngineError';
  }
}
