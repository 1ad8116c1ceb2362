/** Particle simulation of the channel: Brownian molecules, reflecting walls, absorbing receivers. */
package dev.nanoplan.sim;
