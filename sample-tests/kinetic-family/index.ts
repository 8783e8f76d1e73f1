/** Family B: a kinetic, smooth-transition physiological generator (see README.md). */
export * from './model';
export { simulateCourse, courseAt, firstCrossingS, COURSE_STEP_S, type Course, type CoursePoint } from './course';
export * from './generate';
export * from './grid';
