/** Small value types for positions and the fluid volumes nodes live in (vectors, open space, box, cylinder). */
package dev.nanoplan.geometry;
