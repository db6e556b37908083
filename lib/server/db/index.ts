import 'server-only';
import { getSequelize } from './connection';

// Server code takes its models from here: importing this module initialises them first.
getSequelize();

export * from '@/models';
export { closeSequelize, getSequelize } from './connection';
