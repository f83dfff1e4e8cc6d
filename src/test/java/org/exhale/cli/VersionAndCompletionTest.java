package org.exhale.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** {@code --version} shows the filtered build properties; {@code completion} covers every command. */
class VersionAndCompletionTest {
    @Test
    void versionShowsTheProjectVersionAndACommit() {
        NewAndCheckCommandTest.Run r = NewAndCheckCommandTest.run("--version");
        assertEquals(0, r.code());
        // Filtering must have replaced the placeholders (the build runs from a git checkout or says "unknown").
        assertTrue(r.out().matches("exhale \\d+\\.\\d+\\.\\d+(-SNAPSHOT)? \\(commit ([0-9a-f]{7,40}|unknown)\\)\\s*"), r.out());
        assertTrue(!r.out().contains("${"), r.out());
        // every subcommand answers --version as well
        NewAndCheckCommandTest.Run sub = NewAndCheckCommandTest.run("check", "--version");
        assertEquals(r.out(), sub.out());
    }

    @Test
    void completionScriptCoversCommandsAndChoices() {
        NewAndCheckCommandTest.Run r = NewAndCheckCommandTest.run("completion");
        assertEquals(0, r.code(), r.err());
        String s = r.out();
        assertTrue(s.startsWith("#!/usr/bin/env bash"), s.substring(0, Math.min(80, s.length())));
        for (String word : new String[] {"new", "check", "simulate", "fit", "demo", "completion", "--dense", "--force",
                "(\"line\" \"disc\" \"rectangle\")", "complete -F _complete_exhale"}) {
            assertTrue(s.contains(word), "completion script lacks " + word);
        }
        // zsh support comes from bash completion emulation in the same script
        assertTrue(s.contains("zsh"), "script should say how zsh loads it");
    }

    @Test
    void bashCompletesTheKindsOfNew(@org.junit.jupiter.api.io.TempDir java.nio.file.Path dir) throws Exception {
        java.nio.file.Path bash = java.nio.file.Path.of("/bin/bash");
        org.junit.jupiter.api.Assumptions.assumeTrue(java.nio.file.Files.isExecutable(bash), "no bash here");
        java.nio.file.Path script = dir.resolve("exhale-completion.sh");
        java.nio.file.Files.writeString(script, NewAndCheckCommandTest.run("completion").out());
        String probe = "source '" + script + "' 2>/dev/null; COMP_WORDS=(exhale new ''); COMP_CWORD=2; "
                + "_complete_exhale 2>/dev/null; printf '%s\\n' \"${COMPREPLY[@]}\"";
        Process p = new ProcessBuilder(bash.toString(), "--norc", "-c", probe).redirectErrorStream(true).start();
        String out = new String(p.getInputStream().readAllBytes(), java.nio.charset.StandardCharsets.UTF_8);
        assertEquals(0, p.waitFor());
        assertEquals("line\ndisc\nrectangle\n", out);
    }
}
