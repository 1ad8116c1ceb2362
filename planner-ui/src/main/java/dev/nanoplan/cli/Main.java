package dev.nanoplan.cli;

/** Entry point of the {@code nanoplan} command line. */
public final class Main {

    private Main() {
    }

    public static void main(String[] args) {
        System.exit(NanoplanCommand.execute(args));
    }
}
