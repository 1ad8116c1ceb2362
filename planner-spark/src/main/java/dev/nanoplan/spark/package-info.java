/** The Apache Spark engine: nanoplan's work units as a Spark job (docs/decisions/0005-spark-engine-module.md). */
package dev.nanoplan.spark;
