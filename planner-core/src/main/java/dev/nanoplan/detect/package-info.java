/** Threshold detection on molecule counts: binary thresholds and multi-level quantizers. */
package dev.nanoplan.detect;
