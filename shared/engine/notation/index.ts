export { notate } from './notate';
export { ottavaOctaves } from './staff-position';
