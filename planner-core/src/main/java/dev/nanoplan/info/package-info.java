/** Entropy, mutual information, channel capacity, Blahut–Arimoto and cascades of channels. */
package dev.nanoplan.info;
