package dev.reweigh.apidump;

import java.io.IOException;
import java.io.InputStream;
import java.lang.module.ModuleDescriptor;
import java.lang.reflect.Constructor;
import java.lang.reflect.Field;
import java.lang.reflect.Member;
import java.lang.reflect.Method;
import java.lang.reflect.Modifier;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.Collectors;
import java.util.stream.Stream;

/**
 * Writes the public API of a module's exported packages as sorted text lines and compares them with
 * the committed dump {@code <module>/api/<module>.api}. Shared by every module's ApiDumpTest
 * through this module's test jar, so that the rule is written once.
 */
public final class ApiDump {
    private ApiDump() {
    }

    /**
     * Compares the compiled API of the module whose tests are running with its committed dump,
     * or rewrites the dump when the system property {@code reweigh.updateApi} is true.
     */
    public static void verify() throws IOException {
        Path moduleDir = Path.of(System.getProperty("basedir", ".")).toAbsolutePath();
        String moduleName = moduleDir.getFileName().toString();
        Path classes = moduleDir.resolve("target/classes");
        Path dumpFile = moduleDir.resolve("api").resolve(moduleName + ".api");
        List<String> actual = dump(classes);
        if (Boolean.getBoolean("reweigh.updateApi")) {
            Files.createDirectories(dumpFile.getParent());
            Files.write(dumpFile, actual, StandardCharsets.UTF_8);
            return;
        }
        List<String> expected = Files.exists(dumpFile)
                ? Files.readAllLines(dumpFile, StandardCharsets.UTF_8) : List.of();
        if (!expected.equals(actual)) {
            Set<String> onlyInCode = new TreeSet<>(actual);
            expected.forEach(onlyInCode::remove);
            Set<String> onlyInDump = new TreeSet<>(expected);
            actual.forEach(onlyInDump::remove);
            StringBuilder msg = new StringBuilder("The public API of ").append(moduleName)
                    .append(" differs from ").append(moduleDir.getParent().relativize(dumpFile)).append('\n');
            onlyInCode.forEach(l -> msg.append("+ ").append(l).append('\n'));
            onlyInDump.forEach(l -> msg.append("- ").append(l).append('\n'));
            msg.append("If the change is deliberate, refresh the dump with:\n  mvn -B -q install -DskipTests && mvn -B -q test -pl ")
                    .append(moduleName)
                    .append(" -Dtest=ApiDumpTest -Dsurefire.failIfNoSpecifiedTests=false -Dreweigh.updateApi=true");
            throw new AssertionError(msg.toString());
        }
    }

    /** Returns the sorted API lines of the exported packages compiled under {@code classes}. */
    public static List<String> dump(Path classes) throws IOException {
        ModuleDescriptor descriptor;
        try (InputStream in = Files.newInputStream(classes.resolve("module-info.class"))) {
            descriptor = ModuleDescriptor.read(in);
        }
        TreeSet<String> lines = new TreeSet<>();
        for (ModuleDescriptor.Exports export : descriptor.exports()) {
            if (export.isQualified()) {
                continue;
            }
            Path dir = classes.resolve(export.source().replace('.', '/'));
            List<String> classNames;
            try (Stream<Path> files = Files.list(dir)) {
                classNames = files.map(p -> p.getFileName().toString())
                        .filter(n -> n.endsWith(".class") && !n.equals("package-info.class") && !n.contains("$"))
                        .map(n -> export.source() + "." + n.substring(0, n.length() - ".class".length()))
                        .collect(Collectors.toList());
            }
            for (String name : classNames) {
                Class<?> type;
                try {
                    type = Class.forName(name, false, ApiDump.class.getClassLoader());
                } catch (ClassNotFoundException e) {
                    throw new IOException("cannot load " + name, e);
                }
                addType(type, lines);
            }
        }
        return new ArrayList<>(lines);
    }

    private static void addType(Class<?> type, Set<String> lines) {
        if (!isVisible(type.getModifiers()) || type.isSynthetic()) {
            return;
        }
        String typeName = type.getName();
        lines.add(typeName + " : " + describeType(type));
        for (Constructor<?> c : type.getDeclaredConstructors()) {
            if (visible(c) && !c.isSynthetic()) {
                lines.add(typeName + " : " + c.toGenericString());
            }
        }
        for (Method m : type.getDeclaredMethods()) {
            if (visible(m) && !m.isSynthetic() && !m.isBridge()) {
                lines.add(typeName + " : " + m.toGenericString());
            }
        }
        for (Field f : type.getDeclaredFields()) {
            if (visible(f) && !f.isSynthetic()) {
                lines.add(typeName + " : " + f.toGenericString());
            }
        }
        for (Class<?> nested : type.getDeclaredClasses()) {
            addType(nested, lines);
        }
    }

    private static String describeType(Class<?> type) {
        StringBuilder sb = new StringBuilder(type.toGenericString());
        if (type.getGenericSuperclass() != null && type.getSuperclass() != Object.class
                && !type.isEnum() && !type.isRecord()) {
            sb.append(" extends ").append(type.getGenericSuperclass().getTypeName());
        }
        if (type.getGenericInterfaces().length > 0) {
            sb.append(type.isInterface() ? " extends " : " implements ");
            sb.append(Stream.of(type.getGenericInterfaces()).map(t -> t.getTypeName())
                    .collect(Collectors.joining(", ")));
        }
        return sb.toString();
    }

    private static boolean visible(Member m) {
        return isVisible(m.getModifiers());
    }

    private static boolean isVisible(int modifiers) {
        return Modifier.isPublic(modifiers) || Modifier.isProtected(modifiers);
    }
}
