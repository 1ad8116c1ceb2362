/** The scenario file format {@code nanoplan/1}: validated records, reader with located problems, atomic writer. */
package dev.nanoplan.scenario;
