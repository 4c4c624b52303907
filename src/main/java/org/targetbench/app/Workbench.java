package org.targetbench.app;

import org.targetbench.Version;
import org.targetbench.export.Safety;

import javax.swing.AbstractAction;
import javax.swing.BorderFactory;
import javax.swing.DefaultListCellRenderer;
import javax.swing.JComponent;
import javax.swing.JFrame;
import javax.swing.JLabel;
import javax.swing.JList;
import javax.swing.JMenu;
import javax.swing.JMenuBar;
import javax.swing.JMenuItem;
import javax.swing.JOptionPane;
import javax.swing.JPanel;
import javax.swing.KeyStroke;
import javax.swing.ListSelectionModel;
import java.awt.BorderLayout;
import java.awt.CardLayout;
import java.awt.Component;
import java.awt.Rectangle;
import java.awt.event.ActionEvent;
import java.awt.event.KeyEvent;
import java.awt.event.WindowAdapter;
import java.awt.event.WindowEvent;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.prefs.Preferences;

/**
 * The workbench window: a list of views on the left, the chosen view in the middle, a status bar below. Remembers
 * the last view, the theme and the window bounds.
 */
public final class Workbench extends JFrame {
    private final Session session = new Session();
    private final JLabel status = new JLabel(" ");
    private final CardLayout cards = new CardLayout();
    private final JPanel center = new JPanel(cards);
    private final JList<String> nav;
    private final Map<String, JComponent> views = new LinkedHashMap<>();
    private final Preferences prefs;
    private final DetectionRunner runner;
    private final LiveView live;
    private final CameraView camera;
    private final ServoView servo;
    private final ExportView exportView;

    public Workbench(Preferences prefs) {
        super("TargetBench " + Version.get());
        this.prefs = prefs;
        setName("workbench");
        setDefaultCloseOperation(JFrame.DO_NOTHING_ON_CLOSE); // closing asks first when work is unsaved (SessionMenu)
        AppContext ctx = new AppContext(session, this::setStatus, prefs, this, this::show);
        runner = new DetectionRunner(session);
        live = new LiveView(ctx);
        views.put("Live", live);
        views.put("Camera", camera = new CameraView(ctx));
        live.onCamerasFound(d -> {
            show("Camera");
            camera.offer(d, CameraView.WEBCAMS);
        });
        views.put("Compare", compareView = new CompareView(ctx));
        views.put("Stress", stressView = new StressView(ctx));
        views.put("Track", new TrackView(ctx));
        views.put("Servo set", servo = new ServoView(ctx));
        views.put("Rehearse", rehearseView = new RehearseView(ctx));
        views.put("Export", exportView = new ExportView(ctx));
        views.put("Targets", designsView = new DesignsView(ctx));
        views.put("Shoot-out", shootoutView = new ShootoutView(ctx, designsView::designs));
        views.put("Calibration", calibrationView = new CalibrationView(ctx));
        sessions = new SessionMenu(ctx, live, this::dispose);
        for (var e : views.entrySet()) center.add(e.getValue(), e.getKey());

        nav = new JList<>(views.keySet().toArray(String[]::new));
        nav.setName("nav");
        nav.setSelectionMode(ListSelectionModel.SINGLE_SELECTION);
        nav.setBorder(BorderFactory.createEmptyBorder(8, 8, 8, 8));
        nav.setCellRenderer(new DefaultListCellRenderer() {
            @Override public Component getListCellRendererComponent(JList<?> l, Object v, int i, boolean sel, boolean focus) {
                JLabel c = (JLabel) super.getListCellRendererComponent(l, v, i, sel, focus);
                c.setBorder(BorderFactory.createEmptyBorder(6, 10, 6, 24));
                return c;
            }
        });
        nav.addListSelectionListener(e -> {
            if (e.getValueIsAdjusting() || nav.getSelectedValue() == null) return;
            cards.show(center, nav.getSelectedValue());
            prefs.put("view", nav.getSelectedValue());
        });
        status.setName("status");
        status.setBorder(BorderFactory.createEmptyBorder(3, 8, 3, 8));
        JPanel root = new JPanel(new BorderLayout());
        root.add(nav, BorderLayout.WEST);
        root.add(center, BorderLayout.CENTER);
        root.add(status, BorderLayout.SOUTH);
        setContentPane(root);
        setJMenuBar(menus());
        keys(root);
        restoreBounds();
        addWindowListener(new WindowAdapter() {
            @Override public void windowClosing(WindowEvent e) { sessions.quit(); }
            @Override public void windowClosed(WindowEvent e) {
                saveBounds();
                runner.shutdown();
                camera.stop();
            }
        });
        String last = prefs.get("view", "Live");
        nav.setSelectedValue(views.containsKey(last) ? last : "Live", true);
    }

    private JMenuBar menus() {
        JMenuBar bar = new JMenuBar();
        bar.add(sessions.fileMenu());
        JMenu view = new JMenu("View");
        JMenuItem theme = new JMenuItem("Switch light/dark theme");
        theme.setName("menu.theme");
        theme.setAccelerator(KeyStroke.getKeyStroke(KeyEvent.VK_T, java.awt.event.InputEvent.CTRL_DOWN_MASK));
        theme.addActionListener(e -> {
            boolean dark = !prefs.getBoolean("dark", false);
            prefs.putBoolean("dark", dark);
            WorkbenchApp.applyTheme(dark);
            javax.swing.SwingUtilities.updateComponentTreeUI(this);
        });
        view.add(theme);
        bar.add(view);
        JMenu help = new JMenu("Help");
        JMenuItem about = new JMenuItem("About and safety");
        about.setName("menu.about");
        about.addActionListener(e -> JOptionPane.showMessageDialog(this, "<html><body style='width:420px'><b>TargetBench " + Version.get()
                + "</b><br><br>" + Safety.NOTICE + "</body></html>", "About TargetBench", JOptionPane.INFORMATION_MESSAGE));
        help.add(sessions.shortcutsItem());
        help.add(about);
        bar.add(help);
        return bar;
    }

    private void keys(JComponent root) {
        bind(root, "SPACE", "play", live::togglePlay);
        bind(root, "RIGHT", "next", () -> session.setFrameIndex(session.frameIndex() + 1));
        bind(root, "LEFT", "previous", () -> session.setFrameIndex(session.frameIndex() - 1));
        bind(root, "ctrl E", "export", () -> {
            show("Export");
            exportView.chooseAndExport();
        });
    }

    private static void bind(JComponent c, String key, String name, Runnable r) {
        c.getInputMap(JComponent.WHEN_ANCESTOR_OF_FOCUSED_COMPONENT).put(KeyStroke.getKeyStroke(key), name);
        c.getActionMap().put(name, new AbstractAction() {
            @Override public void actionPerformed(ActionEvent e) { r.run(); }
        });
    }

    private void restoreBounds() {
        int w = prefs.getInt("w", 1280), h = prefs.getInt("h", 820);
        setBounds(new Rectangle(prefs.getInt("x", 60), prefs.getInt("y", 40), Math.max(900, w), Math.max(600, h)));
    }

    private void saveBounds() {
        Rectangle r = getBounds();
        prefs.putInt("x", r.x);
        prefs.putInt("y", r.y);
        prefs.putInt("w", r.width);
        prefs.putInt("h", r.height);
    }

    void setStatus(String text) { status.setText(text); }

    public Session session() { return session; }

    LiveView live() { return live; }

    CameraView camera() { return camera; }

    ServoView servo() { return servo; }

    private RehearseView rehearseView;
    private final SessionMenu sessions;

    SessionMenu sessions() { return sessions; }

    private DesignsView designsView;
    private StressView stressView;
    private CompareView compareView;

    CompareView compareView() { return compareView; }

    StressView stressView() { return stressView; }

    DesignsView designsView() { return designsView; }

    private ShootoutView shootoutView;
    private CalibrationView calibrationView;

    ShootoutView shootoutView() { return shootoutView; }

    CalibrationView calibrationView() { return calibrationView; }

    RehearseView rehearseView() { return rehearseView; }

    ExportView exportView() { return exportView; }

    /** Names of the views, in navigation order. */
    public List<String> viewNames() { return new ArrayList<>(views.keySet()); }

    /** Component name of a view's panel, for lookups. */
    public String panelName(String view) { return views.get(view).getName(); }

    /** Shows a view by name. */
    public void show(String view) { nav.setSelectedValue(view, true); }
}
