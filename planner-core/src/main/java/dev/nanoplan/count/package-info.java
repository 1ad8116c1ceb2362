/** Distributions of the number of molecules a receiver counts in one symbol slot. */
package dev.nanoplan.count;
