/** Fabrication tolerances: perturbed layouts, per-sample plans, yields, drivers and guard bands. */
package dev.nanoplan.tolerance;
