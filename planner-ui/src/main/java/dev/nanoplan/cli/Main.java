package dev.nanoplan.cli;

public final class Main {
    public static void main(String[] args) { System.exit(0); }
}
