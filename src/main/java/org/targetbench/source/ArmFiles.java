package org.targetbench.source;

import com.fasterxml.jackson.databind.JsonNode;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;
import org.xml.sax.SAXException;

import javax.xml.XMLConstants;
import javax.xml.parsers.DocumentBuilder;
import javax.xml.parsers.DocumentBuilderFactory;
import javax.xml.parsers.ParserConfigurationException;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Reads an arm description as plain data: our {@code arm.json} (a DH table with limits, docs/formats.md) or a URDF
 * file (the ROS robot description format; the serial chain from the root link to a named tip link, revolute and
 * fixed joints only). The arm model itself is built from this data by {@code pipeline.ArmInputs}.
 */
public final class ArmFiles {
    /** What a file described. */
    public sealed interface Loaded permits DhArm, UrdfArm {}

    /**
     * A DH table of 6 rows {a m, alpha rad, d m, theta offset rad}, limits in radians and rad/s, an optional tool
     * transform (xyz m, rpy rad; null for none) and the reference joints (radians, null when not given).
     */
    public record DhArm(String name, String origin, String convention, double[][] rows, double[] lowerRad, double[] upperRad,
                        double[] maxSpeedRadS, double[] toolXyz, double[] toolRpy, double[] referenceJointsRad) implements Loaded {}

    /** One joint of a URDF chain, base to tip: revolute (with limits) or fixed; origin xyz (m) and rpy (rad), axis. */
    public record UrdfJoint(String name, boolean revolute, double[] xyz, double[] rpy, double[] axis, double lower, double upper, double velocity) {}

    /** A URDF serial chain from the root link to the tip with exactly 6 revolute joints. */
    public record UrdfArm(String name, String origin, String tip, List<UrdfJoint> chain) implements Loaded {}

    private static final long MAX_BYTES = 8 << 20;

    private ArmFiles() {}

    /** As {@link #read(Path, String)} for a file named by a string. */
    public static Loaded read(String file, String tip) throws SourceException {
        return read(Path.of(file), tip);
    }

    /** A URDF file (XML, with {@code tip}, null = the chain's only leaf) or an arm.json, told apart by content. */
    public static Loaded read(Path file, String tip) throws SourceException {
        if (!Files.isRegularFile(file)) throw new SourceException("arm file not found: " + file);
        String text = readText(file);
        if (text.stripLeading().startsWith("<")) return urdf(text, file.toString(), tip);
        if (tip != null) throw new SourceException("--tip applies to a URDF arm, but " + file + " is not XML");
        return armJson(file);
    }

    static String readText(Path file) throws SourceException {
        try {
            if (Files.size(file) > MAX_BYTES) throw new SourceException(file + " is larger than 8 MiB; not an arm description");
            String s = new String(Files.readAllBytes(file), StandardCharsets.UTF_8);
            return s.startsWith("\uFEFF") ? s.substring(1) : s;
        } catch (IOException e) {
            throw new SourceException("cannot read " + file + ": " + ImageFiles.oneLine(e));
        }
    }

    /** arm.json: name, convention, 6 joints with DH parameters and limits, optional tool and reference joints. */
    static Loaded armJson(Path file) throws SourceException {
        JsonIn.Parsed p = JsonIn.parse(file);
        JsonIn in = p.in();
        JsonNode root = p.root();
        String name = root.hasNonNull("name") ? root.get("name").asText() : file.getFileName().toString();
        String conv = root.hasNonNull("convention") ? root.get("convention").asText().trim().toLowerCase(Locale.ROOT) : "standard";
        if (!conv.equals("standard") && !conv.equals("modified")) throw in.error("convention", "must be standard or modified, got \"" + conv + "\"");
        JsonNode joints = root.get("joints");
        if (joints == null || !joints.isArray()) throw in.error("joints", "is missing (an array of 6 joints)");
        if (joints.size() != 6) throw in.error("joints", "has " + joints.size() + " joints; a DH arm needs exactly 6 revolute joints");
        double[][] rows = new double[6][];
        double[] lo = new double[6], hi = new double[6], sp = new double[6];
        for (int i = 0; i < 6; i++) {
            JsonNode j = joints.get(i);
            String w = "joints[" + i + "]";
            rows[i] = new double[]{in.number(j, "a_m", w), Math.toRadians(in.number(j, "alpha_deg", w)), in.number(j, "d_m", w),
                    Math.toRadians(in.number(j, "theta_offset_deg", w, 0))};
            lo[i] = Math.toRadians(in.number(j, "min_deg", w));
            hi[i] = Math.toRadians(in.number(j, "max_deg", w));
            sp[i] = Math.toRadians(in.number(j, "max_speed_deg_s", w));
            if (!(lo[i] < hi[i])) throw in.error(w, "needs min_deg < max_deg");
            if (!(sp[i] > 0)) throw in.error(w + ".max_speed_deg_s", "must be > 0");
        }
        double[] toolXyz = null, toolRpy = null;
        if (root.hasNonNull("tool")) {
            JsonNode t = root.get("tool");
            toolXyz = vec(in, t, "xyz_m", "tool");
            double[] rpy = vec(in, t, "rpy_deg", "tool");
            toolRpy = new double[]{Math.toRadians(rpy[0]), Math.toRadians(rpy[1]), Math.toRadians(rpy[2])};
        }
        double[] ref = null;
        if (root.hasNonNull("reference_joints_deg")) {
            double[] d = vecN(in, root, "reference_joints_deg", "", 6);
            ref = new double[6];
            for (int i = 0; i < 6; i++) ref[i] = Math.toRadians(d[i]);
        }
        if (ref != null)
            for (int i = 0; i < 6; i++)
                if (ref[i] < lo[i] || ref[i] > hi[i]) throw in.error("reference_joints_deg", "joint " + (i + 1) + " lies outside its limits");
        return new DhArm(name, file.toString(), conv, rows, lo, hi, sp, toolXyz, toolRpy, ref);
    }

    private static double[] vec(JsonIn in, JsonNode parent, String field, String where) throws SourceException {
        return vecN(in, parent, field, where, 3);
    }

    private static double[] vecN(JsonIn in, JsonNode parent, String field, String where, int n) throws SourceException {
        JsonNode a = parent.get(field);
        String w = where.isEmpty() ? field : where + "." + field;
        if (a == null || !a.isArray() || a.size() != n) throw in.error(w, "must be an array of " + n + " numbers");
        double[] v = new double[n];
        for (int i = 0; i < n; i++) v[i] = in.finite(a.get(i), w + "[" + i + "]");
        return v;
    }

    /**
     * The serial chain of a URDF from its root link to {@code tip} (null: the single leaf link). Each joint's origin
     * (xyz, rpy: R = Rz(yaw) Ry(pitch) Rx(roll)) and axis; fixed joints fold into the transforms around them. Exactly
     * 6 revolute joints with limits are accepted; prismatic, planar, floating and continuous joints are refused.
     */
    public static UrdfArm urdf(String xml, String origin, String tip) throws SourceException {
        Document doc;
        try {
            DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
            f.setFeature(XMLConstants.FEATURE_SECURE_PROCESSING, true);
            f.setFeature("http://apache.org/xml/features/disallow-doctype-decl", true);
            f.setExpandEntityReferences(false);
            DocumentBuilder b = f.newDocumentBuilder();
            b.setErrorHandler(null);
            doc = b.parse(new ByteArrayInputStream(xml.getBytes(StandardCharsets.UTF_8)));
        } catch (ParserConfigurationException | SAXException | IOException e) {
            throw new SourceException("URDF " + origin + " is not well-formed XML: " + ImageFiles.oneLine(e));
        }
        Element robot = doc.getDocumentElement();
        if (!robot.getTagName().equals("robot")) throw new SourceException("URDF " + origin + ": the root element must be <robot>, got <" + robot.getTagName() + ">");
        Map<String, Element> jointByChild = new HashMap<>();
        Map<String, Integer> children = new HashMap<>();
        List<String> links = new ArrayList<>();
        NodeList ls = robot.getElementsByTagName("link");
        for (int i = 0; i < ls.getLength(); i++) links.add(((Element) ls.item(i)).getAttribute("name"));
        NodeList js = robot.getElementsByTagName("joint");
        for (int i = 0; i < js.getLength(); i++) {
            Element j = (Element) js.item(i);
            if (j.getParentNode() != robot) continue; // transmissions also hold <joint> elements
            String parent = attr(child(j, "parent", origin), "link", origin), ch = attr(child(j, "child", origin), "link", origin);
            jointByChild.put(ch, j);
            children.merge(parent, 1, Integer::sum);
        }
        String tipLink = tip;
        if (tipLink == null) {
            List<String> leaves = links.stream().filter(l -> !children.containsKey(l)).toList();
            if (leaves.size() != 1) throw new SourceException("URDF " + origin + " has " + leaves.size() + " leaf links " + leaves + "; name the tip with --tip LINK");
            tipLink = leaves.get(0);
        } else if (!links.contains(tipLink)) {
            throw new SourceException("URDF " + origin + " has no link named \"" + tipLink + "\" for the tip");
        }
        List<Element> chain = new ArrayList<>();
        String cur = tipLink;
        while (jointByChild.containsKey(cur)) {
            Element j = jointByChild.get(cur);
            chain.add(0, j);
            cur = attr(child(j, "parent", origin), "link", origin);
            if (chain.size() > 1000) throw new SourceException("URDF " + origin + " has a loop in its joints");
        }
        List<UrdfJoint> out = new ArrayList<>();
        int n = 0;
        for (Element j : chain) {
            String type = j.getAttribute("type"), name = j.getAttribute("name");
            Element o = firstChild(j, "origin");
            double[] xyz = o != null && o.hasAttribute("xyz") ? triple(o.getAttribute("xyz"), origin, name + " origin xyz") : new double[3];
            double[] rpy = o != null && o.hasAttribute("rpy") ? triple(o.getAttribute("rpy"), origin, name + " origin rpy") : new double[3];
            switch (type) {
                case "fixed" -> out.add(new UrdfJoint(name, false, xyz, rpy, null, 0, 0, 0));
                case "revolute" -> {
                    if (n == 6) throw new SourceException("URDF " + origin + ": the chain to \"" + tipLink + "\" has more than 6 revolute joints; TargetBench models 6-axis arms");
                    Element ax = firstChild(j, "axis");
                    double[] axis = ax == null ? new double[]{1, 0, 0} : triple(ax.getAttribute("xyz"), origin, name + " axis");
                    if (Math.sqrt(axis[0] * axis[0] + axis[1] * axis[1] + axis[2] * axis[2]) < 1e-9)
                        throw new SourceException("URDF " + origin + ": joint \"" + name + "\" has a zero axis");
                    Element lim = firstChild(j, "limit");
                    if (lim == null) throw new SourceException("URDF " + origin + ": revolute joint \"" + name + "\" has no <limit>");
                    double lo = num(lim, "lower", 0, origin, name), hi = num(lim, "upper", 0, origin, name), sp = num(lim, "velocity", Double.NaN, origin, name);
                    if (!(lo < hi)) throw new SourceException("URDF " + origin + ": joint \"" + name + "\" needs lower < upper, got " + lo + ", " + hi);
                    if (!(sp > 0)) throw new SourceException("URDF " + origin + ": joint \"" + name + "\" needs a velocity limit > 0");
                    out.add(new UrdfJoint(name, true, xyz, rpy, axis, lo, hi, sp));
                    n++;
                }
                case "continuous" -> throw new SourceException("URDF " + origin + ": joint \"" + name + "\" is continuous (no position limits); "
                        + "give it type revolute with limits");
                default -> throw new SourceException("URDF " + origin + ": joint \"" + name + "\" is " + (type.isEmpty() ? "untyped" : type)
                        + "; only revolute and fixed joints are supported");
            }
        }
        if (n != 6) throw new SourceException("URDF " + origin + ": the chain from \"" + cur + "\" to \"" + tipLink + "\" has " + n
                + " revolute joints; TargetBench needs exactly 6");
        String name = robot.getAttribute("name");
        return new UrdfArm(name.isEmpty() ? origin : name, origin, tipLink, out);
    }

    private static double[] triple(String s, String origin, String what) throws SourceException {
        String[] p = s.trim().split("\\s+");
        if (p.length != 3) throw new SourceException("URDF " + origin + ": " + what + " needs 3 numbers, got \"" + s + "\"");
        double[] v = new double[3];
        try {
            for (int i = 0; i < 3; i++) v[i] = Double.parseDouble(p[i]);
        } catch (NumberFormatException e) {
            throw new SourceException("URDF " + origin + ": " + what + " is not numeric: \"" + s + "\"");
        }
        for (double d : v) if (!Double.isFinite(d)) throw new SourceException("URDF " + origin + ": " + what + " must be finite");
        return v;
    }

    private static double num(Element e, String attr, double fallback, String origin, String joint) throws SourceException {
        if (!e.hasAttribute(attr)) {
            if (Double.isNaN(fallback)) throw new SourceException("URDF " + origin + ": joint \"" + joint + "\" limit has no " + attr);
            return fallback;
        }
        try {
            double v = Double.parseDouble(e.getAttribute(attr).trim());
            if (!Double.isFinite(v)) throw new NumberFormatException();
            return v;
        } catch (NumberFormatException ex) {
            throw new SourceException("URDF " + origin + ": joint \"" + joint + "\" limit " + attr + " is not a finite number");
        }
    }

    private static Element child(Element j, String tag, String origin) throws SourceException {
        Element c = firstChild(j, tag);
        if (c == null) throw new SourceException("URDF " + origin + ": joint \"" + j.getAttribute("name") + "\" has no <" + tag + ">");
        return c;
    }

    private static Element firstChild(Element e, String tag) {
        for (org.w3c.dom.Node n = e.getFirstChild(); n != null; n = n.getNextSibling())
            if (n instanceof Element el && el.getTagName().equals(tag)) return el;
        return null;
    }

    private static String attr(Element e, String a, String origin) throws SourceException {
        String v = e.getAttribute(a);
        if (v.isEmpty()) throw new SourceException(String.format(Locale.ROOT, "URDF %s: <%s> has no %s", origin, e.getTagName(), a));
        return v;
    }
}
