// The part of ml-regression 6.3.0 the reference test uses (the package ships no types).
declare module 'ml-regression' {
  export class SimpleLinearRegression {
    constructor(x: readonly number[], y: readonly number[]);
    readonly slope: number;
    readonly intercept: number;
  }
}
