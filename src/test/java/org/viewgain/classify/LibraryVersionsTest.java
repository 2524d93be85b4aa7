package org.viewgain.classify;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/** run.json's library versions come from the jars on the class path, so they equal what pom.xml asks for. */
class LibraryVersionsTest {
    @Test
    void givenTheBuild_whenLibraryVersionsAreRead_thenTheyEqualThePomsProperties() throws IOException {
        String pom = Files.readString(Path.of("pom.xml"));
        assertEquals(property(pom, "smile.version"), ClassifierRegistry.libraryVersions().get("smile"));
        assertEquals(property(pom, "weka.version"), ClassifierRegistry.libraryVersions().get("weka"));
    }

    private static String property(String pom, String name) {
        Matcher m = Pattern.compile("<" + Pattern.quote(name) + ">([^<]+)</" + Pattern.quote(name) + ">").matcher(pom);
        return m.find() ? m.group(1) : "absent from pom.xml";
    }
}
