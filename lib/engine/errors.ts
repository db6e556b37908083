// Typed input error: every engine function throws this, naming the offending field path.
export class EngineInputError extends Error {
  readonly code = 'ENGINE_INPUT' as const;
  readonly field: string;

  constructor(field: string, message: string) {
    super(`${field}: ${message}`);
    this.name = 'EngineInputError';
    this.field = field;
  }
}
