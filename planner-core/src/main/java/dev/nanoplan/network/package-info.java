/** Nodes, layouts, link evaluation and the link graph. */
package dev.nanoplan.network;
