// One export line per contract file; keep the list sorted by folder.
export * from './auth/auth.schema';
export * from './auth/users.schema';
export * from './common/error.schema';
export * from './engineering/card.schema';
export * from './engineering/envelope.schema';
export * from './engineering/normalize.schema';
export * from './engineering/regulator.schema';
export * from './units/format';
export * from './units/parse';
export * from './units/quantity';
