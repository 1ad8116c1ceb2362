/** Design search: changes a layout (species, molecule budgets, relay positions, new relays) until more demands meet their targets. */
package dev.nanoplan.design;
