/** Work units and the engines that run them: a local thread pool here, Apache Spark in planner-spark. */
package dev.nanoplan.engine;
