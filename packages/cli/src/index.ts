export * from './ingest/index';
