package dev.nanoplan.cli;

import picocli.CommandLine;

/** Reads the version from the jar manifest. */
final class ManifestVersion implements CommandLine.IVersionProvider {

    @Override
    public String[] getVersion() {
        String v = NanoplanCommand.class.getPackage().getImplementationVersion();
        return new String[] {"nanoplan " + (v == null ? "(development build)" : v)};
    }
}
