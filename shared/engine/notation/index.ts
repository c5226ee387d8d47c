export { notate } from './notate';
