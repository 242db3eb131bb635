module colsheet

go 1.26.8

require github.com/Knetic/govaluate v3.0.0+incompatible

require gopkg.in/yaml.v3 v3.0.1

require github.com/yuin/goldmark v1.8.7
