// Mood boards: `directionStatus(brandId)` is the one call other screens need (server-side only).
export { directionStatus, type DirectionStatus } from './direction.server';
