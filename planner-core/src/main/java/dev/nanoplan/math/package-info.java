/** Numerical helpers below every other package: arithmetic on logarithms of tiny probabilities. */
package dev.nanoplan.math;
