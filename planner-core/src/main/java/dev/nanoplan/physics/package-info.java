/** Media, species, hitting models and channel taps. */
package dev.nanoplan.physics;
