/** Writers of results: JSON, CSV, SVG/PNG plots and HTML reports. */
package dev.nanoplan.report;
