// Vitest runs server modules outside Next; `server-only` would throw there.
export {};
