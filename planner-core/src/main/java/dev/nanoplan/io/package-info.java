/** Plain file helpers usable by every layer: atomic writes (temporary file, force, rename). */
package dev.nanoplan.io;
