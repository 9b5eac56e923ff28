#pragma once

#include "brief/brief.h"

#include <QGraphicsView>

namespace abut::gui {

// The adjacency sketch (bubble diagram): rooms as circles sized by their target
// area, adjacencies as lines. Door adjacencies are solid, wall adjacencies
// dashed; `should` adjacencies are drawn thinner, so kinds and priorities read
// without colour. The scene is rebuilt from the brief: the brief is the model.
class SketchView : public QGraphicsView {
    Q_OBJECT
public:
    explicit SketchView(QWidget* parent = nullptr);
    void showBrief(const Brief& brief);
    void fitAll();

protected:
    void wheelEvent(QWheelEvent* event) override;
    void resizeEvent(QResizeEvent* event) override;

private:
    bool autoFit_ = true; // keep fitting the whole sketch until the user zooms
};

} // namespace abut::gui
