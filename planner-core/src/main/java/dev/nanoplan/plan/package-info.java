/** Network plans: routes, bottlenecks, molecule budgets, comparisons and design advice. */
package dev.nanoplan.plan;
